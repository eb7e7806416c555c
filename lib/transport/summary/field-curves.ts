import { interpolateLinear, symmetriseOverField } from '@/lib/transport/physics';
import type { XY } from './curves';

export const bothSigns = (b: XY) => b.x.length > 0 && b.x[0] < 0 && b.x[b.x.length - 1] > 0;

/** Even part over ±B (Onsager) on |B| when both signs were measured, else the measured branch as |B|, ascending. */
export function fieldEvenCurve(binned: XY): { curve: XY; symmetrised: boolean } {
  if (bothSigns(binned)) {
    const s = symmetriseOverField(binned.x, binned.y);
    return { curve: { x: s.absFieldT, y: s.values }, symmetrised: true };
  }
  const sign = binned.x[binned.x.length - 1] > 0 ? 1 : -1;
  const idx = binned.x.map((_, i) => i).filter((i) => binned.x[i] * sign >= 0).sort((i, j) => Math.abs(binned.x[i]) - Math.abs(binned.x[j]));
  return { curve: { x: idx.map((i) => Math.abs(binned.x[i])), y: idx.map((i) => binned.y[i]) }, symmetrised: false };
}

/** Value at B = 0 when the curve starts within 2 % of its |B| range of zero (linear extrapolation of the first segment). */
export function valueAtZeroField(curve: XY): number | null {
  if (curve.x.length < 2) return null;
  const maxB = curve.x[curve.x.length - 1];
  return curve.x[0] <= 0.02 * maxB ? interpolateLinear(curve, 0) : null;
}
