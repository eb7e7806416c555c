import { createLTTB } from 'downsample';

// Largest-triangle-three-buckets downsampling (Steinarsson 2013) through the 'downsample' package. On long curves an
// M4-style pass (min, max, first, last per bucket; Jugel et al., VLDB 2014) first keeps ≤ 8 candidates per target
// point, so LTTB never materialises a million point objects.
const CANDIDATES_PER_POINT = 8;

function m4Candidates(x: Float64Array, y: Float64Array, buckets: number): number[] {
  const out: number[] = [];
  const size = x.length / buckets;
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor(b * size);
    const end = Math.min(x.length, Math.floor((b + 1) * size));
    let first = -1;
    let last = -1;
    let lo = -1;
    let hi = -1;
    for (let i = start; i < end; i++) {
      if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) continue;
      if (first < 0) first = i;
      last = i;
      if (lo < 0 || y[i] < y[lo]) lo = i;
      if (hi < 0 || y[i] > y[hi]) hi = i;
    }
    if (first < 0) continue;
    const picked = [...new Set([first, lo, hi, last])].sort((p, q) => p - q);
    out.push(...picked);
  }
  return out;
}

function finiteIndices(x: Float64Array, y: Float64Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) out.push(i);
  return out;
}

/** At most `target` (x, y) points of a curve in file order, chosen by LTTB; also the count of finite pairs. */
export function downsampleCurve(x: Float64Array, y: Float64Array, target: number): { points: [number, number][]; sourcePoints: number } {
  let sourcePoints = 0;
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) sourcePoints++;
  const candidates = x.length > target * CANDIDATES_PER_POINT ? m4Candidates(x, y, Math.ceil((target * CANDIDATES_PER_POINT) / 4)) : finiteIndices(x, y);
  const lttb = createLTTB<number>({ x: (i: number) => x[i], y: (i: number) => y[i] });
  const chosen = candidates.length > target && target >= 3 ? Array.from(lttb(candidates, target)) : candidates;
  return { points: chosen.map((i) => [x[i], y[i]] as [number, number]), sourcePoints };
}
