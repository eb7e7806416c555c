import { describe, expect, it } from 'vitest';
import { allanDeviation, allanDeviationCurve, compareToJohnsonFloor, johnsonNoiseVoltage, pointToPointScatter } from '@/lib/transport/physics';
import { seededNormal, seededRandom } from './seeded-random';

describe('point-to-point scatter of sweeps (second differences / √6)', () => {
  it('recovers white-noise σ on top of a smooth curve (evenly spaced)', () => {
    const g = seededNormal(42);
    const sigma = 2e-7;
    const n = 20000;
    const y = Array.from({ length: n }, (_, i) => 1e-3 * Math.sin(i / 2000) + 5e-4 * (i / n) ** 2 + sigma * g());
    const r = pointToPointScatter(y)!;
    expect(r.sigma / sigma).toBeCloseTo(1, 1); // within ±5 % for 2e4 points
    expect(r.pointsUsed).toBe(n);
  });

  it('equals std(second differences)/√6 for even spacing (definition)', () => {
    const y = [1, 3, 2, 5, 4, 7, 5];
    const d = y.slice(1, -1).map((v, i) => y[i] - 2 * v + y[i + 2]);
    const mean = d.reduce((s, v) => s + v, 0) / d.length;
    const std = Math.sqrt(d.reduce((s, v) => s + (v - mean) ** 2, 0) / (d.length - 1));
    expect(pointToPointScatter(y)!.sigma).toBeCloseTo(std / Math.sqrt(6), 14);
  });

  it('is zero for a straight line or a parabola, on an uneven grid too', () => {
    const rnd = seededRandom(3);
    let x = 0;
    const xs = Array.from({ length: 50 }, () => (x += 0.5 + rnd()));
    expect(pointToPointScatter(xs.map((v) => 3 - 2 * v), xs)!.sigma).toBeLessThan(1e-12);
    expect(pointToPointScatter([0, 1, 4, 9, 16, 25].map((v) => v * 1e-6))!.sigma).toBeLessThan(1e-18);
    // Fewer than two usable residuals (too short, or every neighbour pair at one x): no figure rather than a guess.
    expect(pointToPointScatter([1, 2, 3])).toBeNull();
    expect(pointToPointScatter([1, 2, 3, 4, 5], [1, 1, 1, 1, 1])).toBeNull();
  });

  it('recovers σ on an uneven grid', () => {
    const g = seededNormal(9);
    const rnd = seededRandom(10);
    let x = 0;
    const xs = Array.from({ length: 20000 }, () => (x += 0.2 + rnd()));
    const y = xs.map((v) => Math.cos(v / 500) + 0.01 * g());
    expect(pointToPointScatter(y, xs)!.sigma / 0.01).toBeCloseTo(1, 1);
  });
});

describe('Allan deviation (Riley, NIST SP 1065)', () => {
  it('for white noise σ_A(m) ≈ σ/√m, overlapping and not', () => {
    const g = seededNormal(1);
    const y = Array.from({ length: 40000 }, () => 1e-6 * g());
    for (const m of [1, 4, 16]) {
      expect(allanDeviation(y, m).deviation / (1e-6 / Math.sqrt(m)), `m = ${m}`).toBeCloseTo(1, 1);
      expect(allanDeviation(y, m, { overlapping: false }).deviation / (1e-6 / Math.sqrt(m))).toBeCloseTo(1, 1);
    }
    expect(allanDeviation(y, 4).terms).toBe(40000 - 8 + 1);
    expect(allanDeviation(y, 4, { overlapping: false }).terms).toBe(40000 / 4 - 1);
  });

  it('m = 1 is ½⟨(y₂ − y₁)²⟩ under the square root (definition)', () => {
    const r = allanDeviation([1, 2, 4], 1, { intervalS: 0.5 });
    expect(r.deviation).toBeCloseTo(Math.sqrt((1 + 4) / 4), 14);
    expect(r.tauS).toBe(0.5);
  });

  it('grows with m for a linear drift (σ_A = drift·m/√2 per reading)', () => {
    const y = Array.from({ length: 1000 }, (_, i) => 1e-9 * i);
    expect(allanDeviation(y, 10).deviation).toBeCloseTo((1e-9 * 10) / Math.SQRT2, 18);
    const curve = allanDeviationCurve(y, { intervalS: 1 });
    expect(curve.map((c) => c.clusterSize)).toEqual([1, 2, 4, 8, 16, 32, 64, 128, 256]); // 2m ≤ N = 1000
  });

  it('refuses too few readings', () => {
    expect(() => allanDeviation([1, 2, 3], 2)).toThrow(RangeError);
  });
});

describe('ratio to the Johnson–Nyquist floor', () => {
  it('a measured 25.74 nV over 10 Hz on 1 kΩ at 300 K is 2.0× the 12.87159 nV floor (Johnson and Nyquist 1928)', () => {
    const c = compareToJohnsonFloor(25.74318e-9, 1e3, 300, 10);
    expect(c.johnsonFloorV * 1e9).toBeCloseTo(12.87159, 5);
    expect(c.ratio).toBeCloseTo(2, 5);
    expect(johnsonNoiseVoltage(300, 1e3, 10)).toBe(c.johnsonFloorV);
  });
});
