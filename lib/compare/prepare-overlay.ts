// From basket entries and the reader's settings to the curves as drawn: chosen quantities, harmonised units,
// normalisation, log-axis filtering and LTTB downsampling (display only; the CSV export starts from full data).
import { downsampleCurve } from '@/lib/transport/summary/preview';
import { optionFor, missingReason } from './choose-axes';
import { normalisedLabel, referenceValue, type Normalisation } from './normalise';
import { curveStyle, type CurveStyle } from './palette';
import { parseAxisKey, quantityText } from './quantities';
import type { CompareEntry, CurveOption } from './types';
import { findUnit, unitOptions, type DisplayUnit } from './units';

export type OverlaySettings = {
  xKey: string;
  yKey: string;
  /** UCUM codes of the display units (see units.ts). */
  xUnit: string;
  yUnit: string;
  normalisation: Normalisation;
  logX: boolean;
  logY: boolean;
};

/** Most points drawn per curve; stored previews hold 500, so this only bites for bigger local previews. */
export const DISPLAY_POINTS = 1000;

export type OverlayAxes = {
  xUnit: DisplayUnit;
  /** The ratio unit '1' when normalised. */
  yUnit: DisplayUnit;
  xSymbol: string;
  ySymbol: string;
  /** Axis titles with units: 'T (K)', 'ρ/ρ(300 K)'. */
  xTitle: string;
  yTitle: string;
  xName: string;
  yName: string;
};

export type PreparedCurve = {
  key: string;
  /** 1-based position in the basket: the legend number and the CSV `curve` value. */
  number: number;
  style: CurveStyle;
  entry: CompareEntry;
  option: CurveOption;
  /** Divisor applied to y (SI), 1 when not normalised. */
  reference: number;
  x: number[];
  y: number[];
  notes: string[];
};

export type ExcludedCurve = { key: string; number: number; entry: CompareEntry; reason: string };

export type PreparedOverlay = { axes: OverlayAxes; curves: PreparedCurve[]; excluded: ExcludedCurve[] };

const RATIO: DisplayUnit = { ucum: '1', label: '', factor: 1 };
const withUnit = (title: string, unit: DisplayUnit) => (unit.label ? `${title} (${unit.label})` : title);

/** Units, symbols and titles of the two axes for these settings. */
export function overlayAxes(s: OverlaySettings): OverlayAxes {
  const x = parseAxisKey(s.xKey);
  const y = parseAxisKey(s.yKey);
  const xUnit = findUnit(x.ucum, s.xUnit) ?? unitOptions(x.ucum)[0];
  const xSymbol = quantityText(x.quantity).symbol;
  const ySymbolBare = quantityText(y.quantity).symbol;
  const normalised = s.normalisation.kind !== 'none';
  const yUnit = normalised ? RATIO : (findUnit(y.ucum, s.yUnit) ?? unitOptions(y.ucum)[0]);
  const ySymbol = normalisedLabel(s.normalisation, ySymbolBare, { xUnit, xSymbol });
  return {
    xUnit, yUnit, xSymbol, ySymbol,
    xTitle: withUnit(xSymbol, xUnit), yTitle: withUnit(ySymbol, yUnit),
    xName: quantityText(x.quantity).name, yName: normalised ? `${quantityText(y.quantity).name}, normalised` : quantityText(y.quantity).name,
  };
}

export type ScaledCurve = { x: number[]; y: number[]; droppedForLog: number };

/** SI values to display values (÷ unit factor, ÷ reference), dropping non-finite pairs and, on log axes, values ≤ 0. */
export function scaleCurve(xs: ArrayLike<number>, ys: ArrayLike<number>, reference: number, axes: OverlayAxes, log: { x: boolean; y: boolean }): ScaledCurve {
  const out: ScaledCurve = { x: [], y: [], droppedForLog: 0 };
  const kx = 1 / axes.xUnit.factor;
  const ky = 1 / (reference * axes.yUnit.factor);
  for (let i = 0; i < xs.length; i++) {
    const a = xs[i] * kx;
    const b = ys[i] * ky;
    if (!Number.isFinite(a) || !Number.isFinite(b)) continue;
    // A log axis cannot show zero or negative values (common practice: leave them out and say so).
    if ((log.x && a <= 0) || (log.y && b <= 0)) {
      out.droppedForLog++;
      continue;
    }
    out.x.push(a);
    out.y.push(b);
  }
  return out;
}

function logNote(dropped: number, log: { x: boolean; y: boolean }): string | null {
  if (dropped === 0) return null;
  const axes = log.x && log.y ? 'log axes cannot' : log.x ? 'a log x axis cannot' : 'a log y axis cannot';
  return `${dropped} point${dropped === 1 ? '' : 's'} at or below zero left out: ${axes} show them.`;
}

/** The curves to draw, in basket order, and the entries left out with the reason. */
export function prepareOverlay(entries: readonly CompareEntry[], s: OverlaySettings): PreparedOverlay {
  const axes = overlayAxes(s);
  const log = { x: s.logX, y: s.logY };
  const curves: PreparedCurve[] = [];
  const excluded: ExcludedCurve[] = [];
  entries.forEach((entry, i) => {
    const base = { key: entry.key, number: i + 1, entry };
    const option = optionFor(entry, s.xKey, s.yKey);
    if (!option) {
      excluded.push({ ...base, reason: missingReason(entry, s.xKey, s.yKey) });
      return;
    }
    const xs = option.points.map((p) => p[0]);
    const ys = option.points.map((p) => p[1]);
    const ref = referenceValue(xs, ys, s.normalisation, { xUnit: axes.xUnit, xSymbol: axes.xSymbol });
    if (!ref.ok) {
      excluded.push({ ...base, reason: ref.reason });
      return;
    }
    const scaled = scaleCurve(xs, ys, ref.value, axes, log);
    const notes = [ref.note, logNote(scaled.droppedForLog, log)].filter((n): n is string => n !== null);
    let { x, y } = scaled;
    if (x.length > DISPLAY_POINTS) {
      const lttb = downsampleCurve(Float64Array.from(x), Float64Array.from(y), DISPLAY_POINTS);
      x = lttb.points.map((p) => p[0]);
      y = lttb.points.map((p) => p[1]);
    }
    if (option.sourcePoints > x.length + scaled.droppedForLog) {
      notes.push(`Drawn from ${x.length} of ${option.sourcePoints} points (downsampled for display; the CSV export has them all).`);
    }
    if (x.length === 0) {
      excluded.push({ ...base, reason: notes.join(' ') || 'Not shown: no points left to draw.' });
      return;
    }
    curves.push({ ...base, style: curveStyle(i), option, reference: ref.value, x, y, notes });
  });
  return { axes, curves, excluded };
}
