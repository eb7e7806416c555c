import { createLTTB } from 'downsample';

// Largest-triangle-three-buckets downsampling (Steinarsson 2013) through the 'downsample' package. On long curves an
// M4-style pass (min, max, first, last per bucket; Jugel et al., VLDB 2014) first keeps ≤ 8 candidates per target
// point, so LTTB never materialises a million point objects.
const CANDIDATES_PER_POINT = 8;

/** M4 candidates of a curve: indices of the first, lowest, highest and last finite point of each bucket; the finite pairs. */
export type M4 = { candidates: number[]; finite: number };

/** Buckets of the M4 pass for a curve of `length` points and a `target`-point preview; 0 when the curve is short enough. */
export function m4Buckets(length: number, target: number): number {
  return length > target * CANDIDATES_PER_POINT ? Math.ceil((target * CANDIDATES_PER_POINT) / 4) : 0;
}

/**
 * Where M4 bucket `b` of `buckets` over `length` points ends (exclusive). The last bucket always ends at the last point:
 * b × (length / buckets) can round to just below `length` and would leave the final point out.
 */
export function bucketEnd(b: number, buckets: number, length: number): number {
  return b >= buckets - 1 ? length : Math.min(length, Math.floor((b + 1) * (length / buckets)));
}

/** Adds a bucket's candidates in ascending order, each once (first ≤ lo, hi ≤ last). */
export function pushBucket(out: number[], first: number, lo: number, hi: number, last: number): void {
  out.push(first);
  const a = lo < hi ? lo : hi;
  const c = lo < hi ? hi : lo;
  if (a !== first) out.push(a);
  if (c !== a && c !== first) out.push(c);
  if (last !== c && last !== first) out.push(last);
}

function m4Candidates(x: Float64Array, y: Float64Array, buckets: number): M4 {
  const out: number[] = [];
  let finite = 0;
  for (let b = 0, start = 0; b < buckets; b++) {
    const end = bucketEnd(b, buckets, x.length);
    let first = -1;
    let last = -1;
    let lo = -1;
    let hi = -1;
    let loY = 0;
    let hiY = 0;
    for (let i = start; i < end; i++) {
      const a = x[i];
      const v = y[i];
      if (a - a !== 0 || v - v !== 0) continue; // not both finite
      finite++;
      if (first < 0) {
        first = lo = hi = i;
        loY = hiY = v;
      } else if (v < loY) {
        lo = i;
        loY = v;
      } else if (v > hiY) {
        hi = i;
        hiY = v;
      }
      last = i;
    }
    if (first >= 0) pushBucket(out, first, lo, hi, last);
    start = end;
  }
  return { candidates: out, finite };
}

function finiteIndices(x: Float64Array, y: Float64Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) out.push(i);
  return out;
}

/**
 * At most `target` (x, y) points of a curve in file order, chosen by LTTB; also the count of finite pairs. `m4`: the
 * M4 candidates of this curve for m4Buckets(x.length, target) buckets when another pass over it has collected them.
 */
export function downsampleCurve(x: Float64Array, y: Float64Array, target: number, m4?: M4): { points: [number, number][]; sourcePoints: number } {
  let candidates: number[];
  let sourcePoints: number;
  const buckets = m4Buckets(x.length, target);
  if (buckets > 0) ({ candidates, finite: sourcePoints } = m4 ?? m4Candidates(x, y, buckets));
  else {
    candidates = finiteIndices(x, y);
    sourcePoints = candidates.length;
  }
  const lttb = createLTTB<number>({ x: (i: number) => x[i], y: (i: number) => y[i] });
  const chosen = candidates.length > target && target >= 3 ? Array.from(lttb(candidates, target)) : candidates;
  return { points: chosen.map((i) => [x[i], y[i]] as [number, number]), sourcePoints };
}
