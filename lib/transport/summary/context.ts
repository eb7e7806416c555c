import type { TransportDatasetDraft } from '@/lib/schema';
import type { ParsedColumn } from '@/lib/transport/parse';
import type { MeasurementContext } from '@/lib/transport/quality';
import { fieldToTesla, unitInfo } from '@/lib/transport/units';
import { medianStep } from './curves';
import type { GeometrySummary, SweepInfo } from './types';
import { siOf } from './geometry';

function sweepRatePerS(rate: { value?: number; unit?: string } | undefined): number | undefined {
  if (!rate || typeof rate.value !== 'number' || !rate.unit) return undefined;
  if (unitInfo(rate.unit)) return siOf(rate) ?? undefined; // K/min → K/s, T/min → T/s
  // Oe/s and similar have no catalogue dimension: field per time, by the lab convention 1 Oe ↔ 1e-4 T.
  const m = /^(.+)\/(s|min|h)$/.exec(rate.unit);
  if (!m) return undefined;
  const perS = { s: 1, min: 60, h: 3600 }[m[2] as 's' | 'min' | 'h'];
  try {
    return fieldToTesla(rate.value, m[1]) / perS;
  } catch {
    return undefined;
  }
}

/** Enough geometry for an intrinsic quantity: L and A; or a film's thickness (van der Pauw, or an R_s column); or L and w of a film. */
function geometryComplete(metadata: TransportDatasetDraft | undefined, columns: ParsedColumn[], g: GeometrySummary | null): boolean {
  if (columns.some((c) => c.quantity === 'resistivity' && c.converted)) return true;
  if (!g) return false;
  const film = metadata?.sample?.form === 'thin-film';
  const vdp = metadata?.sample?.contacts?.configuration === 'van-der-pauw';
  const sheetColumn = columns.some((c) => c.quantity === 'sheet-resistance' && c.converted);
  if (g.lengthM && g.areaM2) return true;
  if (g.thicknessM && (vdp || sheetColumn)) return true;
  return Boolean(film && g.lengthM && g.widthM);
}

const range = (c: ParsedColumn | undefined) => (c?.range && c.converted ? { ...c.range } : undefined);

/** MeasurementContext for the quality rules, from the metadata and what the data show (all SI). */
export function measurementContext(
  metadata: TransportDatasetDraft | undefined,
  columns: ParsedColumn[],
  sweep: SweepInfo,
  geometry: GeometrySummary | null,
  currentA: number | null,
): MeasurementContext {
  const m = metadata?.measurement;
  const det = m?.detection;
  const by = (q: ParsedColumn['quantity']) => columns.find((c) => c.quantity === q && c.converted);
  const time = by('time');
  const order = det?.filterOrder ?? (det?.filterSlope ? det.filterSlope / 6 : undefined);
  const ctx: MeasurementContext = {
    mode: m?.mode,
    excitation: m?.excitation?.type,
    currentA: currentA ?? undefined,
    frequencyHz: siOf(m?.excitation?.frequency) ?? undefined,
    detection: det?.instrumentType,
    timeConstantS: siOf(det?.timeConstant) ?? undefined,
    filterOrder: order,
    geometryComplete: geometryComplete(metadata, columns, geometry),
    resistanceOhm: range(by('resistance')),
    voltageV: range(by('voltage') ?? by('lock-in-x') ?? by('lock-in-r')),
    temperatureK: range(by('temperature')),
    resistivityOhmM: range(by('resistivity')),
  };
  if (sweep.variable) {
    ctx.sweep = {
      variable: sweep.variable === 'gate-voltage' ? 'other' : sweep.variable,
      ratePerS: sweepRatePerS(metadata?.environment?.sweepRate),
      pointIntervalS: time && time.siUcum === 's' ? (medianStep(time.values) ?? undefined) : undefined,
    };
  }
  if (!ctx.voltageV && ctx.resistanceOhm && currentA) {
    ctx.voltageV = { min: ctx.resistanceOhm.min * currentA, max: ctx.resistanceOhm.max * currentA }; // V = I·R
  }
  return ctx;
}
