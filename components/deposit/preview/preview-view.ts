import { displayScale } from '@/lib/format/quantity';
import type { ColumnSummary, CurvePreview, FileSummary } from '@/lib/transport/summary/types';
import { effectiveColumn, recordColumns } from '@/components/deposit/columns/column-overrides';
import type { UnitChoice } from '@/components/deposit/columns/unit-choice';

export type PreviewView = {
  points: [number, number][];
  xName: string;
  yName: string;
  xUnit: string;
  yUnit: string;
  /** True when the author's mapping changed this curve in a way only a new analysis can show. */
  stale: boolean;
};

type Axis = { convert: (v: number) => number; siUcum: string | null; stale: boolean };

/**
 * How one axis's preview values (SI of the analysed mapping) become SI of the author's current mapping, so a unit
 * fix redraws at once: file value = (si − offset_old)/factor_old, then si_new = value·factor_new + offset_new.
 */
function axisFor(column: ColumnSummary | undefined, entries: ReturnType<typeof recordColumns>, catalogue: UnitChoice[], fallbackUcum: string | null): Axis {
  if (!column) return { convert: (v) => v, siUcum: fallbackUcum, stale: false };
  const eff = effectiveColumn(column, entries);
  const roleOrQuantityChanged = eff.quantity !== column.quantity || eff.role !== column.role;
  if (eff.unit === column.ucum) return { convert: (v) => v, siUcum: fallbackUcum, stale: roleOrQuantityChanged };
  const to = catalogue.find((u) => u.ucum === eff.unit);
  if (!to) return { convert: (v) => v, siUcum: fallbackUcum, stale: true };
  if (!column.converted) return { convert: (v) => v * to.factor + to.offset, siUcum: to.siUcum, stale: roleOrQuantityChanged };
  const from = catalogue.find((u) => u.ucum === column.ucum);
  if (!from || from.siUcum !== to.siUcum) return { convert: (v) => v, siUcum: fallbackUcum, stale: true };
  return { convert: (v) => ((v - from.offset) / from.factor) * to.factor + to.offset, siUcum: to.siUcum, stale: roleOrQuantityChanged };
}

// Symbols the trade uses for the derived curves of lib/transport/summary.
const DERIVED_SYMBOL: Readonly<Record<string, string>> = { resistivity: 'ρ', 'sheet-resistance': 'R□', magnetoresistance: 'MR' };

const byName = (columns: ColumnSummary[], name: string) => columns.find((c) => c.name === name.replace(/^\|(.*)\|$/, '$1'));

/** A preview curve in display units (prefixed, practitioner units for resistivity) under the current mapping. */
export function previewView(preview: CurvePreview, summary: FileSummary, record: unknown, catalogue: UnitChoice[]): PreviewView {
  const entries = recordColumns(record);
  const x = axisFor(byName(summary.columns, preview.x), entries, catalogue, preview.xUcum);
  const yColumn = preview.derived ? undefined : byName(summary.columns, preview.y);
  const y = axisFor(yColumn, entries, catalogue, preview.yUcum);
  // A derived curve (ρ, R_s, MR, Hall) depends on the whole mapping: any change waits for the new analysis.
  const anyChange = summary.columns.some((c) => {
    const eff = effectiveColumn(c, entries);
    return eff.unit !== c.ucum || eff.quantity !== c.quantity || eff.role !== c.role;
  });
  const si = preview.points.map(([a, b]) => [x.convert(a), y.convert(b)] as [number, number]);
  const maxAbs = (i: 0 | 1) => si.reduce((m, p) => (Number.isFinite(p[i]) ? Math.max(m, Math.abs(p[i])) : m), 0);
  const xs = x.siUcum ? displayScale(x.siUcum, maxAbs(0)) : { factor: 1, label: '' };
  const ys = y.siUcum ? displayScale(y.siUcum, maxAbs(1)) : { factor: 1, label: '' };
  return {
    points: si.map(([a, b]) => [a * xs.factor, b * ys.factor]),
    xName: preview.x,
    yName: preview.derived ? (DERIVED_SYMBOL[preview.y] ?? preview.y) : preview.y,
    xUnit: x.siUcum ? xs.label : 'unit unknown',
    yUnit: y.siUcum ? ys.label : 'unit unknown',
    stale: x.stale || y.stale || (preview.derived && anyChange),
  };
}
