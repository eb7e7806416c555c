// Curve helpers for the summary: typed arrays in, small number[] curves out (physics takes plain arrays).
import { bucketEnd, pushBucket, type M4 } from './preview';

export type XY = { x: number[]; y: number[] };

/** Finite (x, y) pairs in file order. */
export function finitePairs(x: Float64Array, y: Float64Array): XY {
  const out: XY = { x: [], y: [] };
  for (let i = 0; i < x.length; i++) {
    const a = x[i];
    const b = y[i];
    if (Number.isFinite(a) && Number.isFinite(b)) {
      out.x.push(a);
      out.y.push(b);
    }
  }
  return out;
}

export function countFinitePairs(x: Float64Array, y: Float64Array): number {
  let n = 0;
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) n++;
  return n;
}

/** The smallest and largest x (the first of equal values) and the count of (x, y) pairs, when every pair is finite. */
export type PairRange = { lo: number; hi: number; n: number };

/**
 * Mean of x and y in equal-width x bins, ascending in x: reduces a million-point sweep to a curve that
 * interpolation, symmetrisation and RRR can use, in one pass. Short curves come back sorted and unbinned.
 */
export function binByX(x: Float64Array, y: Float64Array, bins = 4000, known: PairRange | null = null): XY {
  // v - v === 0 is Number.isFinite(v) for numbers (NaN and ±Infinity give NaN).
  let lo = Infinity;
  let hi = -Infinity;
  let n = 0;
  if (known) ({ lo, hi, n } = known);
  else {
    for (let i = 0; i < x.length; i++) {
      const a = x[i];
      const b = y[i];
      if (a - a !== 0 || b - b !== 0) continue;
      n++;
      if (a < lo) lo = a;
      if (a > hi) hi = a;
    }
  }
  if (n === 0) return { x: [], y: [] };
  if (n <= bins || hi === lo) {
    const p = finitePairs(x, y);
    const order = p.x.map((_, i) => i).sort((i, j) => p.x[i] - p.x[j]);
    return { x: order.map((i) => p.x[i]), y: order.map((i) => p.y[i]) };
  }
  const sx = new Float64Array(bins);
  const sy = new Float64Array(bins);
  const count = new Uint32Array(bins);
  const scale = bins / (hi - lo);
  for (let i = 0; i < x.length; i++) {
    const a = x[i];
    const b = y[i];
    if (a - a !== 0 || b - b !== 0) continue;
    let k = ((a - lo) * scale) | 0; // floor of a value in [0, bins]
    if (k >= bins) k = bins - 1;
    sx[k] += a;
    sy[k] += b;
    count[k]++;
  }
  const out: XY = { x: [], y: [] };
  for (let k = 0; k < bins; k++) {
    if (count[k] === 0) continue;
    out.x.push(sx[k] / count[k]);
    out.y.push(sy[k] / count[k]);
  }
  return out;
}

/**
 * binByX of a curve whose every pair is finite (x's range known), and in the same pass the M4 candidates of the curve
 * for `buckets` index buckets (see preview.ts): the first, lowest, highest and last point of each. Gives exactly what
 * binByX and the M4 pass give one after the other.
 */
export function binByXWithM4(x: Float64Array, y: Float64Array, bins: number, known: PairRange, buckets: number): { binned: XY; m4: M4 } | null {
  const { lo, hi, n } = known;
  if (n <= bins || hi === lo || n !== x.length || buckets <= 0 || n < 4 * buckets) return null;
  const sx = new Float64Array(bins);
  const sy = new Float64Array(bins);
  const count = new Uint32Array(bins);
  const scale = bins / (hi - lo);
  const candidates: number[] = [];
  let bucket = 0;
  let start = 0;
  let end = bucketEnd(0, buckets, n);
  let low = 0;
  let high = 0;
  let lowY = y[0];
  let highY = y[0];
  for (let i = 0; i < n; i++) {
    const a = x[i];
    const v = y[i];
    let k = ((a - lo) * scale) | 0; // floor of a value in [0, bins]
    if (k >= bins) k = bins - 1;
    sx[k] += a;
    sy[k] += v;
    count[k]++;
    if (i === end) {
      pushBucket(candidates, start, low, high, end - 1);
      bucket++;
      start = end;
      end = bucketEnd(bucket, buckets, n);
      low = high = i;
      lowY = highY = v;
    } else if (v < lowY) {
      low = i;
      lowY = v;
    } else if (v > highY) {
      high = i;
      highY = v;
    }
  }
  pushBucket(candidates, start, low, high, n - 1);
  const binned: XY = { x: [], y: [] };
  for (let k = 0; k < bins; k++) {
    if (count[k] === 0) continue;
    binned.x.push(sx[k] / count[k]);
    binned.y.push(sy[k] / count[k]);
  }
  return { binned, m4: { candidates, finite: n } };
}

/** Ordinary least squares y = a + b·x, or y = b·x through the origin (Σxy/Σx²). */
export function linearFit(x: readonly number[], y: readonly number[], throughOrigin = false): { slope: number; intercept: number } {
  const n = x.length;
  if (throughOrigin) {
    let sxy = 0;
    let sxx = 0;
    for (let i = 0; i < n; i++) {
      sxy += x[i] * y[i];
      sxx += x[i] * x[i];
    }
    return { slope: sxy / sxx, intercept: 0 };
  }
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) * (x[i] - mx);
  }
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx };
}

/** A contiguous block of at most `max` finite pairs from the middle of the file (keeps neighbours adjacent). */
export function middleBlock(x: Float64Array, y: Float64Array, max: number): XY {
  const start = x.length > max ? Math.floor((x.length - max) / 2) : 0;
  return finitePairs(x.subarray(start, start + max), y.subarray(start, start + max));
}

/** Median of the positive steps of a series (e.g. seconds between recorded points). */
export function medianStep(values: Float64Array, max = 20000): number | null {
  const steps = new Float64Array(Math.min(max, Math.max(0, values.length - 1)));
  let n = 0;
  for (let i = 1; i < values.length && n < max; i++) {
    const d = values[i] - values[i - 1];
    if (Number.isFinite(d) && d > 0) steps[n++] = d;
  }
  if (n === 0) return null;
  const sorted = steps.subarray(0, n).sort(); // numeric order (typed-array sort)
  return sorted[Math.floor(n / 2)];
}
