// From stored file analyses (FileSummary JSON) to the landing page's curves and derived tables, plus the display
// units each plot axis may switch to. Server-side: the unit catalogue needs the UCUM engine.
import type { FileSummary } from '@/lib/transport/summary/types';
import { CATALOGUE_UCUM, fieldToTesla, unitInfo } from '@/lib/transport/units';
import type { LandingCurves, LandingDerivedFile, UnitOption } from './landing-types';

export type AnalysedFile = { fileId: string; fileName: string; summary: FileSummary };

const isObject = (v: unknown): v is Record<string, unknown> => Boolean(v) && typeof v === 'object' && !Array.isArray(v);

/** A stored analysis that has the parts the page reads; anything else is skipped rather than crashing the page. */
export function asFileSummary(value: unknown): FileSummary | null {
  if (!isObject(value)) return null;
  const ok = Array.isArray(value.previews) && Array.isArray(value.derived) && Array.isArray(value.quality) && Array.isArray(value.columns);
  return ok ? (value as unknown as FileSummary) : null;
}

let catalogueBySi: Map<string, UnitOption[]> | undefined;

/**
 * Catalogue units grouped by the SI unit they convert to. Field-strength units (Oe, kOe, A/m) join tesla by the lab
 * convention 1 Oe ↔ 1e-4 T, as the parser converts them.
 */
function unitsBySi(): Map<string, UnitOption[]> {
  if (catalogueBySi) return catalogueBySi;
  const map = new Map<string, UnitOption[]>();
  for (const ucum of CATALOGUE_UCUM) {
    const info = unitInfo(ucum);
    if (!info) continue;
    const field = info.dimension === 'magneticFieldStrength' || info.dimension === 'magneticFluxDensity';
    const si = field ? 'T' : info.siUcum;
    const option: UnitOption = { ucum, label: info.label, factor: field ? fieldToTesla(1, ucum) : info.factor, offset: field ? 0 : info.offset };
    map.set(si, [...(map.get(si) ?? []), option]);
  }
  catalogueBySi = map;
  return map;
}

/** Units an axis in `siUcum` can be shown in; the SI unit itself always comes first. */
export function unitOptionsFor(siUcum: string): UnitOption[] {
  const known = unitsBySi().get(siUcum) ?? [];
  const self = known.find((u) => u.ucum === siUcum) ?? { ucum: siUcum, label: unitInfo(siUcum)?.label ?? siUcum, factor: 1, offset: 0 };
  return [self, ...known.filter((u) => u.ucum !== siUcum)];
}

/** The files' preview curves, and for every SI unit on an axis the units it may be shown in. */
export function buildCurves(files: AnalysedFile[]): LandingCurves {
  const withCurves = files.filter((f) => f.summary.previews.length > 0);
  const units: Record<string, UnitOption[]> = {};
  for (const f of withCurves) {
    for (const p of f.summary.previews) {
      for (const ucum of [p.xUcum, p.yUcum]) if (ucum && !units[ucum]) units[ucum] = unitOptionsFor(ucum);
    }
  }
  return { files: withCurves.map((f) => ({ fileId: f.fileId, fileName: f.fileName, previews: f.summary.previews })), units };
}

/** Derived values, what could not be computed, and the quality flags of each analysed file. */
export function buildDerived(files: AnalysedFile[]): LandingDerivedFile[] {
  return files.map((f) => ({
    fileId: f.fileId,
    fileName: f.fileName,
    derived: f.summary.derived,
    notComputed: f.summary.notComputed ?? [],
    quality: f.summary.quality,
  }));
}
