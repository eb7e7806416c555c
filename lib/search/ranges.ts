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
import type { SearchDoc } from './types';

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

  /** A predicate over slots for the query's range filters, or null when the query has none. */
  filter(params: RangeFilterParams): ((slot: number) => boolean) | null {
    const { tMin, tMax, bMax, fMin, fMax } = params;
    const overlaps = params.rangeMode === 'overlaps';
    const tests: ((slot: number) => boolean)[] = [];
    const tLo = this.lo.temperatureK, tHi = this.hi.temperatureK;
    if (tMin !== undefined || tMax !== undefined) {
      if (overlaps) {
        const a = tMin ?? -Infinity, b = tMax ?? Infinity;
        tests.push((s) => tHi[s] >= a && tLo[s] <= b);
      } else {
        const a = tMin ?? (tMax as number), b = tMax ?? (tMin as number);
        tests.push((s) => tLo[s] <= a && tHi[s] >= b);
      }
    }
    const bLo = this.lo.fieldT, bHi = this.hi.fieldT;
    if (bMax !== undefined) {
      tests.push(overlaps ? (s) => bLo[s] <= bMax && bHi[s] >= -bMax : (s) => Math.max(-bLo[s], bHi[s]) >= bMax);
    }
    const fLo = this.lo.frequencyHz, fHi = this.hi.frequencyHz;
    if (fMin !== undefined || fMax !== undefined) {
      const a = fMin ?? -Infinity, b = fMax ?? Infinity;
      tests.push(overlaps ? (s) => fHi[s] >= a && fLo[s] <= b : (s) => fLo[s] >= a && fHi[s] <= b);
    }
    // Comparisons with NaN are false, so versions without the range drop out without a separate check.
    if (tests.length === 0) return null;
    if (tests.length === 1) return tests[0];
    return (s) => tests.every((test) => test(s));
  }
}

function columns(capacity: number): Record<RangeKind, Float64Array> {
  return Object.fromEntries(KINDS.map((k) => [k, new Float64Array(capacity).fill(NaN)])) as Record<RangeKind, Float64Array>;
}

function resized(old: Float64Array, capacity: number): Float64Array {
  const next = new Float64Array(capacity).fill(NaN);
  next.set(old.subarray(0, Math.min(old.length, capacity)));
  return next;
}
