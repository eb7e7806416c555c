// Curve helpers for the summary: typed arrays in, small number[] curves out (physics takes plain arrays).

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

/**
 * Mean of x and y in equal-width x bins, ascending in x: reduces a million-point sweep to a curve that
 * interpolation, symmetrisation and RRR can use, in one pass. Short curves come back sorted and unbinned.
 */
export function binByX(x: Float64Array, y: Float64Array, bins = 4000): XY {
  let lo = Infinity;
  let hi = -Infinity;
  let n = 0;
  for (let i = 0; i < x.length; i++) {
    const a = x[i];
    if (!Number.isFinite(a) || !Number.isFinite(y[i])) continue;
    n++;
    if (a < lo) lo = a;
    if (a > hi) hi = a;
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
    if (!Number.isFinite(a) || !Number.isFinite(b)) continue;
    const k = Math.min(bins - 1, Math.floor((a - lo) * scale));
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
  const steps: number[] = [];
  for (let i = 1; i < values.length && steps.length < max; i++) {
    const d = values[i] - values[i - 1];
    if (Number.isFinite(d) && d > 0) steps.push(d);
  }
  if (steps.length === 0) return null;
  steps.sort((a, b) => a - b);
  return steps[Math.floor(steps.length / 2)];
}
