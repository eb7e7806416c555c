import { describe, expect, it } from 'vitest';
import { solveVanDerPauw, vanDerPauwFactor, vanDerPauwResidual } from '@/lib/transport/physics';
import { seededRandom } from './seeded-random';

describe('van der Pauw', () => {
  it('R_A = R_B = 10 Ω → R_s = πR/ln2 = 45.323601 Ω/sq (van der Pauw, Philips Res. Rep. 13, 1 (1958))', () => {
    expect(solveVanDerPauw(10, 10)).toBeCloseTo(45.323601, 6);
    expect(solveVanDerPauw(10, 10)).toBeCloseTo((Math.PI * 10) / Math.LN2, 10);
  });

  it('(10, 5) Ω → 32.642513; (100, 1) Ω → 92.434651 Ω/sq (same equation solved numerically, domain.md)', () => {
    expect(solveVanDerPauw(10, 5)).toBeCloseTo(32.642513, 6);
    expect(solveVanDerPauw(100, 1)).toBeCloseTo(92.434651, 6);
    expect(solveVanDerPauw(5, 10)).toBeCloseTo(32.642513, 6); // symmetric in R_A, R_B
  });

  it('factor f(Q): 1.5→0.9860, 2→0.9603, 3→0.9067, 5→0.8217, 10→0.6993, 100→0.4038 (van der Pauw 1958)', () => {
    const table: [number, number][] = [[1.5, 0.986], [2, 0.9603], [3, 0.9067], [5, 0.8217], [10, 0.6993], [100, 0.4038]];
    for (const [q, f] of table) expect(vanDerPauwFactor(q), `Q = ${q}`).toBeCloseTo(f, 4);
    expect(vanDerPauwFactor(1)).toBeCloseTo(1, 14);
    expect(vanDerPauwFactor(0.25)).toBeCloseTo(vanDerPauwFactor(4), 14);
  });

  it('f satisfies cosh[((Q−1)/(Q+1))·ln2/f] = ½·e^(ln2/f) (van der Pauw 1958, defining relation)', () => {
    for (const q of [1.5, 2, 3, 5, 10, 100, 1000]) {
      const f = vanDerPauwFactor(q);
      const lhs = Math.cosh((((q - 1) / (q + 1)) * Math.LN2) / f);
      const rhs = 0.5 * Math.exp(Math.LN2 / f);
      expect(Math.abs(lhs - rhs) / rhs, `Q = ${q}`).toBeLessThan(1e-12);
    }
  });

  it('solution satisfies its equation to 1e-12 for many random (R_A, R_B) over 12 decades of ratio', () => {
    const rnd = seededRandom(1958);
    for (let i = 0; i < 2000; i++) {
      const rA = 10 ** (-3 + 9 * rnd());
      const rB = rA * 10 ** (-6 + 12 * rnd());
      const rs = solveVanDerPauw(rA, rB);
      expect(Math.abs(vanDerPauwResidual(rA, rB, rs)), `R_A = ${rA}, R_B = ${rB}`).toBeLessThan(1e-12);
      expect(rs).toBeGreaterThanOrEqual((Math.PI * Math.min(rA, rB)) / Math.LN2 * (1 - 1e-12)); // e^(−πR_min/R_s) ≥ ½
      expect(rs).toBeLessThanOrEqual(((Math.PI * (rA + rB)) / (2 * Math.LN2)) * (1 + 1e-12)); // f ≤ 1
    }
  });

  it('refuses non-positive resistances', () => {
    expect(() => solveVanDerPauw(0, 1)).toThrow(RangeError);
    expect(() => solveVanDerPauw(-1, 1)).toThrow(RangeError);
    expect(() => vanDerPauwFactor(0)).toThrow(RangeError);
  });
});
