// Card sparklines for every indexed version in one flat buffer: 64 points at 16-bit resolution inside each curve's own
// bounding box. A sparkline is a drawing aid (≈100 px wide), so 1/65535 of the box is far below a pixel, and 100 k
// versions take 26 MB instead of the ~250 MB that 100 k arrays of [x, y] pairs would. Points come back rounded to
// the store's resolution (restore), so a card's JSON carries no digits the store does not hold.

export const SPARKLINE_MAX_POINTS = 64;
const STEPS = 65535;

export class SparklineStore {
  private codes: Uint16Array;
  private bounds: Float64Array; // xMin, xMax, yMin, yMax per slot
  private counts: Uint8Array;

  constructor(capacity: number) {
    this.codes = new Uint16Array(capacity * SPARKLINE_MAX_POINTS * 2);
    this.bounds = new Float64Array(capacity * 4);
    this.counts = new Uint8Array(capacity);
  }

  grow(capacity: number): void {
    const codes = new Uint16Array(capacity * SPARKLINE_MAX_POINTS * 2);
    codes.set(this.codes.subarray(0, Math.min(this.codes.length, codes.length)));
    const bounds = new Float64Array(capacity * 4);
    bounds.set(this.bounds.subarray(0, Math.min(this.bounds.length, bounds.length)));
    const counts = new Uint8Array(capacity);
    counts.set(this.counts.subarray(0, Math.min(this.counts.length, capacity)));
    this.codes = codes;
    this.bounds = bounds;
    this.counts = counts;
  }

  /** Stores the finite points; more than 64 are thinned to 64 evenly spaced ones (first and last kept). */
  set(slot: number, points: readonly (readonly [number, number])[] | undefined): void {
    let finite = points ?? [];
    for (let i = 0; i < finite.length; i++) {
      if (Number.isFinite(finite[i][0]) && Number.isFinite(finite[i][1])) continue;
      finite = finite.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
      break;
    }
    const kept = thin(finite, SPARKLINE_MAX_POINTS);
    this.counts[slot] = kept.length;
    if (kept.length === 0) return;
    let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
    for (let i = 0; i < kept.length; i++) {
      const x = kept[i][0], y = kept[i][1];
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    }
    const b = slot * 4;
    this.bounds[b] = x0;
    this.bounds[b + 1] = x1;
    this.bounds[b + 2] = y0;
    this.bounds[b + 3] = y1;
    const base = slot * SPARKLINE_MAX_POINTS * 2;
    for (let i = 0; i < kept.length; i++) {
      this.codes[base + 2 * i] = quantise(kept[i][0], x0, x1);
      this.codes[base + 2 * i + 1] = quantise(kept[i][1], y0, y1);
    }
  }

  clear(slot: number): void {
    this.counts[slot] = 0;
  }

  get(slot: number): [number, number][] | undefined {
    const n = this.counts[slot];
    if (n === 0) return undefined;
    const b = slot * 4;
    const x0 = this.bounds[b], x1 = this.bounds[b + 1], y0 = this.bounds[b + 2], y1 = this.bounds[b + 3];
    const base = slot * SPARKLINE_MAX_POINTS * 2;
    const sx = 10 ** decimals(x0, x1);
    const sy = 10 ** decimals(y0, y1);
    const out: [number, number][] = [];
    for (let i = 0; i < n; i++) {
      out.push([restore(this.codes[base + 2 * i], x0, x1, sx), restore(this.codes[base + 2 * i + 1], y0, y1, sy)]);
    }
    return out;
  }
}

function thin<T>(points: readonly T[], max: number): readonly T[] {
  if (points.length <= max) return points;
  return Array.from({ length: max }, (_, i) => points[Math.round((i * (points.length - 1)) / (max - 1))]);
}

function quantise(v: number, lo: number, hi: number): number {
  return hi > lo ? Math.round(((v - lo) / (hi - lo)) * STEPS) : 0;
}

/**
 * Decimal places that resolve a tenth of one step of the box (at least 0: a box wider than 655 350 units is printed in
 * whole units, finer than needed). A stored point is known to half a step; printing more digits would only claim
 * precision the store does not hold (and make every card's JSON longer), while rounding to a tenth of a step keeps the
 * error within 0.55 step.
 */
function decimals(lo: number, hi: number): number {
  return hi > lo ? Math.max(0, Math.ceil(Math.log10((10 * STEPS) / (hi - lo)))) : 0;
}

/** `scale` = 10^places, exact up to 1e22: dividing by it gives the double nearest k·10^−places. */
function restore(code: number, lo: number, hi: number, scale: number): number {
  if (code === 0) return lo;
  if (code === STEPS) return hi;
  const v = lo + (code / STEPS) * (hi - lo);
  return scale > 1e22 ? v : Math.round(v * scale) / scale;
}
