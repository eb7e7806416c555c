// Linear interpolation on sampled curves, shared by field symmetrisation and RRR.

export type Curve = { x: number[]; y: number[] };

/** Sorts (x, y) pairs by x, drops non-finite pairs and averages y at repeated x (e.g. up and down sweeps). */
export function sortedCurve(x: readonly number[], y: readonly number[]): Curve {
  if (x.length !== y.length) throw new RangeError(`x and y differ in length (${x.length} vs ${y.length}).`);
  // Indices of the finite pairs in input order, stably sorted by x (already sorted input, e.g. a binned sweep, is kept).
  const order: number[] = [];
  let ascending = true;
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) continue;
    if (order.length > 0 && x[order[order.length - 1]] > x[i]) ascending = false;
    order.push(i);
  }
  if (!ascending) order.sort((p, q) => x[p] - x[q]);
  const out: Curve = { x: [], y: [] };
  let i = 0;
  while (i < order.length) {
    const xi = x[order[i]];
    let j = i;
    let sum = 0;
    while (j < order.length && x[order[j]] === xi) sum += y[order[j++]];
    out.x.push(xi);
    out.y.push(sum / (j - i));
    i = j;
  }
  return out;
}

/** Linear interpolation at xq on a sorted curve; outside the range, linear extrapolation from the end segment. */
export function interpolateLinear(curve: Curve, xq: number): number {
  const { x, y } = curve;
  if (x.length === 0) return Number.NaN;
  if (x.length === 1) return y[0];
  let lo = 0;
  let hi = x.length - 1;
  if (xq <= x[0]) hi = 1;
  else if (xq >= x[hi]) lo = hi - 1;
  else {
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (x[mid] <= xq) lo = mid;
      else hi = mid;
    }
  }
  if (xq === x[lo]) return y[lo];
  if (xq === x[hi]) return y[hi];
  const w = (xq - x[lo]) / (x[hi] - x[lo]);
  return y[lo] + w * (y[hi] - y[lo]);
}
