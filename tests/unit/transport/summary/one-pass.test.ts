import { describe, expect, it } from 'vitest';
import { bytesFromBuffer, parseTransportTable } from '@/lib/transport/parse';
import { binByX, binByXWithM4, medianStep } from '@/lib/transport/summary/curves';
import { downsampleCurve, m4Buckets } from '@/lib/transport/summary/preview';
import { summariseTable } from '@/lib/transport/summary/summarise-table';
import { seededRandom } from '../physics/seeded-random';

// The summary reads each long column pair as few times as it can: the x column's range from the parse stands in for
// binByX's first pass, and the M4 candidates of a preview are collected while binning. Both must give what the
// separate passes give, bit for bit.

/** A field loop B(i) with R = R0·(1 + β·B²) plus noise, quantised so that equal values (ties) occur. */
function loop(n: number, seed: number): { x: Float64Array; y: Float64Array } {
  const random = seededRandom(seed);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = Math.round(9000 * Math.sin((2 * Math.PI * i) / n)) / 1000; // T, to 1 mT
    y[i] = Math.round(1000 * (125 * (1 + 0.004 * x[i] * x[i]) + 0.01 * (random() - 0.5))) / 1000; // Ω, to 1 mΩ
  }
  return { x, y };
}

function range(x: Float64Array): { lo: number; hi: number; n: number } {
  let [lo, hi] = [Infinity, -Infinity];
  for (const v of x) [lo, hi] = [v < lo ? v : lo, v > hi ? v : hi];
  return { lo, hi, n: x.length };
}

describe('one pass instead of several', () => {
  it.each([
    [50_000, 500, 1],
    [123_457, 500, 2],
    [20_000, 300, 3],
    // Lengths where (buckets × (n / buckets)) rounds below n: the last bucket must still end at the last point.
    [4004, 500, 4],
    [4007, 500, 5],
  ])('binByXWithM4 on %i points (preview of %i) = binByX, then the M4 pass', (n, target, seed) => {
    const { x, y } = loop(n, seed);
    const both = binByXWithM4(x, y, 4000, range(x), m4Buckets(n, target));
    expect(both).not.toBeNull();
    expect(both?.binned).toEqual(binByX(x, y));
    expect(downsampleCurve(x, y, target, both?.m4)).toEqual(downsampleCurve(x, y, target));
  });

  it('binByXWithM4 declines curves binByX does not bin (too short, or constant x)', () => {
    const { x, y } = loop(3000, 4);
    expect(binByXWithM4(x, y, 4000, range(x), 750)).toBeNull();
    const flat = new Float64Array(10_000).fill(2);
    expect(binByXWithM4(flat, y, 4000, { lo: 2, hi: 2, n: 10_000 }, 1000)).toBeNull();
  });

  it('medianStep: the median of the positive steps (common practice), in typed-array order', () => {
    // Positive steps 1, 2, 5, 1.5 → sorted 1, 1.5, 2, 5; the element at n/2 (the upper of the middle two) is 2.
    expect(medianStep(Float64Array.from([0, 1, 3, 3, 2, 7, 8.5]))).toBe(2);
    expect(medianStep(Float64Array.from([0, 0.5, 0.75, 3]))).toBe(0.5); // steps 0.5, 0.25, 2.25 → middle 0.5
    expect(medianStep(Float64Array.from([5, 4, NaN, 3]))).toBeNull();
  });

  it('summariseTable gives the same summary when the column counts rule the shortcuts out (the separate passes run)', async () => {
    const { x, y } = loop(60_000, 5);
    const rows = Array.from(x, (b, i) => `${(i * 0.05).toFixed(2)},${b},${y[i]}`);
    const text = `t (s),B (T),R (Ohm)\n${rows.join('\n')}\n`;
    const table = await parseTransportTable(bytesFromBuffer(new TextEncoder().encode(text)), { parallel: false });
    expect(table.columns.map((c) => [c.nanCount, c.infiniteCount])).toEqual([[0, 0], [0, 0], [0, 0]]);
    // The same values, but counted as if one were infinite: binByX makes its own first pass, the preview its own M4 pass.
    const counted = { ...table, columns: table.columns.map((c) => ({ ...c, infiniteCount: 1 })) };
    const fast = summariseTable(table);
    expect(summariseTable(counted)).toEqual(fast);
    expect(fast.derived.find((d) => d.key === 'magnetoresistance.at-max-field')?.value).toBeCloseTo(32.4, 0); // β·B² at 9 T
  });
});
