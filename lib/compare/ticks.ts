// Axis ranges and ticks for the SVG export (uPlot computes its own on screen): steps of 1, 2 or 5 × 10ⁿ on linear
// axes, decades with 2–9 sub-ticks on log axes (common plotting practice).
import { formatNumber } from '@/lib/format/quantity';

export type Tick = { value: number; label: string | null };
export type AxisScale = { lo: number; hi: number; log: boolean; ticks: Tick[] };

const snap = (v: number, step: number) => Number((Math.round(v / step) * step).toPrecision(12));

function niceStep(span: number, target: number): number {
  const raw = span / target;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const r = raw / magnitude;
  return (r < 1.5 ? 1 : r < 3 ? 2 : r < 7 ? 5 : 10) * magnitude;
}

/** A linear axis covering [min, max], widened to whole steps, with about `target` labelled ticks. */
export function linearScale(min: number, max: number, target = 6): AxisScale {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return linearScale(0, 1, target);
  if (min === max) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.1;
    return linearScale(min - pad, max + pad, target);
  }
  const step = niceStep(max - min, target);
  const lo = snap(Math.floor(min / step + 1e-9) * step, step);
  const hi = snap(Math.ceil(max / step - 1e-9) * step, step);
  const ticks: Tick[] = [];
  for (let k = 0; lo + k * step <= hi + step * 1e-9; k++) {
    const value = snap(lo + k * step, step);
    ticks.push({ value, label: formatNumber(value, 4) });
  }
  return { lo, hi, log: false, ticks };
}

/** A log axis from the decade at or below min to the decade at or above max; 2 and 5 labelled when it is short. */
export function logScale(min: number, max: number): AxisScale {
  if (!(min > 0) || !(max > 0)) return logScale(1, 10);
  let first = Math.floor(Math.log10(min) + 1e-9);
  let last = Math.ceil(Math.log10(max) - 1e-9);
  if (last === first) [first, last] = [first, first + 1];
  const decades = last - first;
  const labelEvery = Math.ceil(decades / 8);
  const ticks: Tick[] = [];
  for (let d = first; d <= last; d++) {
    const decade = Number((10 ** d).toPrecision(12));
    ticks.push({ value: decade, label: (d - first) % labelEvery === 0 ? formatNumber(decade, 3, true) : null });
    if (d === last) break;
    for (let m = 2; m <= 9; m++) {
      const value = Number((m * 10 ** d).toPrecision(12));
      ticks.push({ value, label: decades <= 2 && (m === 2 || m === 5) ? formatNumber(value, 3, true) : null });
    }
  }
  return { lo: Number((10 ** first).toPrecision(12)), hi: Number((10 ** last).toPrecision(12)), log: true, ticks };
}

/** Position 0..1 of a value along an axis. */
export function fraction(scale: AxisScale, v: number): number {
  if (scale.log) return (Math.log10(v) - Math.log10(scale.lo)) / (Math.log10(scale.hi) - Math.log10(scale.lo));
  return (v - scale.lo) / (scale.hi - scale.lo);
}
