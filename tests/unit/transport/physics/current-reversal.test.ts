import { describe, expect, it } from 'vitest';
import { deltaSeries, resistanceFromReversal, reversalAverage, threeReadingDelta } from '@/lib/transport/physics';

describe('current reversal and delta', () => {
  it('V₊ = 1.005 mV, V₋ = −0.995 mV → 1.000 mV (domain.md; common practice, delta method)', () => {
    expect(reversalAverage(1.005e-3, -0.995e-3)).toBeCloseTo(1e-3, 15);
    expect(resistanceFromReversal(1.005e-3, -0.995e-3, 10e-6)).toBeCloseTo(100, 10);
  });

  it('three-reading delta cancels a constant offset and a linear drift exactly (common practice)', () => {
    const v = 2.5e-6;
    const offset = 5e-6;
    const drift = 0.7e-6; // per reading
    const reading = (i: number, sign: number) => sign * v + offset + drift * i;
    expect(threeReadingDelta(reading(0, 1), reading(1, -1), reading(2, 1))).toBeCloseTo(v, 18);
    const series = deltaSeries([0, 1, 2, 3, 4, 5].map((i) => reading(i, i % 2 === 0 ? 1 : -1)));
    expect(series).toHaveLength(4);
    for (const d of series) expect(d).toBeCloseTo(v, 18);
  });

  it('a plain reversal average keeps half the drift step, the delta does not', () => {
    expect(reversalAverage(1e-6 + 0, -1e-6 + 0.2e-6)).toBeCloseTo(0.9e-6, 18);
  });
});
