// Linear interpolation on sampled curves, shared by field symmetrisation and RRR.

export type Curve = { x: number[]; y: number[] };

/** Sorts (x, y) pairs by x, drops non-finite pairs and averages y at repeated x (e.g. up and down sweeps). */
export function sortedCurve(x: readonly number[], y: readonly number[]): Curve {
  if (x.length !== y.length) throw new RangeError(`x and y differ in length (${x.length} vs ${y.length}).`);
  const pairs = x.map((xi, i) => [xi, y[i]] as const).filter(([a, b]) => Number.isFinite(a) && Number.isFinite(b));
  pairs.sort((p, q) => p[0] - q[0]);
  const out: Curve = { x: [], y: [] };
  let i = 0;
  while (i < pairs.length) {
    let j = i;
    let sum = 0;
    while (j < pairs.length && pairs[j][0] === pairs[i][0]) sum += pairs[j++][1];
    out.x.push(pairs[i][0]);
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
