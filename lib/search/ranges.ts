// Numeric ranges of every indexed version in flat columns, and the range filters of a query.
//
// What a filter means (rangeMode 'covers', the default):
//   temperature tMin=a, tMax=b: the curve spans the whole [a, b] (docMin ≤ a and docMax ≥ b); a single bound is a point
//     the curve must include, so tMin=a alone means docMin ≤ a ≤ docMax.
//   field bMax=x ("B up to x"): the curve reaches |B| ≥ x, i.e. max(|docMin|, |docMax|) ≥ x.
//   frequency fMin=a, fMax=b ("f in a band"): every frequency of the curve lies in the band (a ≤ docMin, docMax ≤ b).
// rangeMode 'overlaps' relaxes all three to "some of the curve is in the range": docMax ≥ a and docMin ≤ b for T and f
//   (a single bound is a half-line), and docMin ≤ x and docMax ≥ −x for B (some points at |B| ≤ x).
// A version without the range in question never passes a filter on it (a DC curve has no frequency range).
//
// Bounds are matched within BOUND_TOLERANCE of their size, in the direction that admits the curve: a sweep logged as
// 2.0015–299.9998 K is a "2–300 K" curve (the controller settles near, not on, its set points), and a magnet ramped to
// 9 T that reads 8.998 T at the top has reached 9 T.
import type { SearchDoc } from './types';

/** Relative tolerance on every bound of a range filter (1 %, our choice: well beyond how far a settled reading strays
 * from its set point). */
export const BOUND_TOLERANCE = 0.01;

// A bound moved down or up by BOUND_TOLERANCE of its magnitude (an open end, ±Infinity, stays as it is).
const below = (v: number) => (Number.isFinite(v) ? v - BOUND_TOLERANCE * Math.abs(v) : v);
const above = (v: number) => (Number.isFinite(v) ? v + BOUND_TOLERANCE * Math.abs(v) : v);

export type RangeFilterParams = {
  tMin?: number;
  tMax?: number;
  bMax?: number;
  fMin?: number;
  fMax?: number;
  rangeMode?: 'covers' | 'overlaps';
};

const KINDS = ['temperatureK', 'fieldT', 'frequencyHz', 'thicknessM'] as const;
export type RangeKind = (typeof KINDS)[number];

/** Per-slot [min, max] of each range; NaN where the version has none. */
export class RangeColumns {
  private lo: Record<RangeKind, Float64Array>;
  private hi: Record<RangeKind, Float64Array>;

  constructor(capacity: number) {
    this.lo = columns(capacity);
    this.hi = columns(capacity);
  }

  grow(capacity: number): void {
    for (const kind of KINDS) {
      this.lo[kind] = resized(this.lo[kind], capacity);
      this.hi[kind] = resized(this.hi[kind], capacity);
    }
  }

  set(slot: number, ranges: SearchDoc['ranges']): void {
    // Named reads, not a loop over keys: range objects come in many shapes and a keyed read of each is slow.
    this.put('temperatureK', slot, ranges.temperatureK);
    this.put('fieldT', slot, ranges.fieldT);
    this.put('frequencyHz', slot, ranges.frequencyHz);
    this.put('thicknessM', slot, ranges.thicknessM);
  }

  get(slot: number): SearchDoc['ranges'] {
    const out: SearchDoc['ranges'] = {};
    const { lo, hi } = this;
    if (!Number.isNaN(lo.temperatureK[slot])) out.temperatureK = [lo.temperatureK[slot], hi.temperatureK[slot]];
    if (!Number.isNaN(lo.fieldT[slot])) out.fieldT = [lo.fieldT[slot], hi.fieldT[slot]];
    if (!Number.isNaN(lo.frequencyHz[slot])) out.frequencyHz = [lo.frequencyHz[slot], hi.frequencyHz[slot]];
    if (!Number.isNaN(lo.thicknessM[slot])) out.thicknessM = [lo.thicknessM[slot], hi.thicknessM[slot]];
    return out;
  }

  private put(kind: RangeKind, slot: number, r: [number, number] | undefined): void {
    const ok = r !== undefined && Number.isFinite(r[0]) && Number.isFinite(r[1]);
    // Stored ordered, so a range given as [max, min] still filters correctly.
    this.lo[kind][slot] = ok ? Math.min(r[0], r[1]) : NaN;
    this.hi[kind][slot] = ok ? Math.max(r[0], r[1]) : NaN;
  }

  /** Whether the query filters on any range. */
  filters(params: RangeFilterParams): boolean {
    return [params.tMin, params.tMax, params.bMax, params.fMin, params.fMax].some((v) => v !== undefined);
  }

  /**
   * Keeps, in order at the front of `slots[0..length)`, the slots passing every range filter of the query; returns
   * how many. One tight loop per filter, each over what the previous one kept. Comparisons with NaN are false, so
   * versions without the range in question drop out without a separate check.
   */
  narrow(params: RangeFilterParams, slots: Int32Array, length: number): number {
    const { tMin, tMax, bMax, fMin, fMax } = params;
    const overlaps = params.rangeMode === 'overlaps';
    const { lo, hi } = this;
    if (tMin !== undefined || tMax !== undefined) {
      const [tLo, tHi] = [lo.temperatureK, hi.temperatureK];
      if (overlaps) length = keepReaching(slots, length, tLo, tHi, above(tMax ?? Infinity), below(tMin ?? -Infinity));
      else length = keepReaching(slots, length, tLo, tHi, above(tMin ?? (tMax as number)), below(tMax ?? (tMin as number)));
    }
    if (bMax !== undefined) {
      if (overlaps) length = keepReaching(slots, length, lo.fieldT, hi.fieldT, above(bMax), -above(bMax));
      else length = keepBeyond(slots, length, lo.fieldT, hi.fieldT, below(bMax));
    }
    if (fMin !== undefined || fMax !== undefined) {
      const a = below(fMin ?? -Infinity), b = above(fMax ?? Infinity);
      if (overlaps) length = keepReaching(slots, length, lo.frequencyHz, hi.frequencyHz, b, a);
      else length = keepWithin(slots, length, lo.frequencyHz, hi.frequencyHz, a, b);
    }
    return length;
  }
}

// covers [a, b] is lo ≤ a and hi ≥ b; overlaps [a, b] is lo ≤ b and hi ≥ a: both keep lo ≤ loAtMost and hi ≥ hiAtLeast.
function keepReaching(slots: Int32Array, length: number, lo: Float64Array, hi: Float64Array, loAtMost: number, hiAtLeast: number): number {
  let kept = 0;
  for (let i = 0; i < length; i++) {
    const s = slots[i];
    if (lo[s] <= loAtMost && hi[s] >= hiAtLeast) slots[kept++] = s;
  }
  return kept;
}

// The curve reaches |B| ≥ x: max(−lo, hi) ≥ x (the largest |B| of [lo, hi] is at one of its ends).
function keepBeyond(slots: Int32Array, length: number, lo: Float64Array, hi: Float64Array, x: number): number {
  let kept = 0;
  for (let i = 0; i < length; i++) {
    const s = slots[i];
    if (Math.max(-lo[s], hi[s]) >= x) slots[kept++] = s;
  }
  return kept;
}

// Every value in the band: a ≤ lo and hi ≤ b.
function keepWithin(slots: Int32Array, length: number, lo: Float64Array, hi: Float64Array, a: number, b: number): number {
  let kept = 0;
  for (let i = 0; i < length; i++) {
    const s = slots[i];
    if (lo[s] >= a && hi[s] <= b) slots[kept++] = s;
  }
  return kept;
}

function columns(capacity: number): Record<RangeKind, Float64Array> {
  return Object.fromEntries(KINDS.map((k) => [k, new Float64Array(capacity).fill(NaN)])) as Record<RangeKind, Float64Array>;
}

function resized(old: Float64Array, capacity: number): Float64Array {
  const next = new Float64Array(capacity).fill(NaN);
  next.set(old.subarray(0, Math.min(old.length, capacity)));
  return next;
}
