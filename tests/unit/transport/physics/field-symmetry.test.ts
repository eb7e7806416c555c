import { describe, expect, it } from 'vitest';
import { antisymmetriseOverField, magnetoresistance, symmetriseOverField } from '@/lib/transport/physics';
import { seededRandom } from './seeded-random';

describe('magnetoresistance and ±B symmetrisation (Onsager reciprocity)', () => {
  it('R(0) = 1.00, R(+B) = 1.10, R(−B) = 1.12 Ω → R_sym = 1.11 Ω, MR = 11.0 % (domain.md, definition)', () => {
    const s = symmetriseOverField([0, 1, -1], [1.0, 1.1, 1.12]);
    expect(s.absFieldT).toEqual([0, 1]);
    expect(s.values[1]).toBeCloseTo(1.11, 14);
    expect(100 * magnetoresistance(s.values[1], s.values[0])).toBeCloseTo(11.0, 12);
  });

  it('R_xy(+B) = +0.52, R_xy(−B) = −0.48 Ω → antisymmetric 0.50 Ω, offset 0.02 Ω (domain.md, definition)', () => {
    const a = antisymmetriseOverField([1, -1], [0.52, -0.48]);
    expect(a.values[0]).toBeCloseTo(0.5, 14);
    expect(a.otherPart[0]).toBeCloseTo(0.02, 14);
  });

  it('returns an even function unchanged and its antisymmetric part as 0, from unsorted data', () => {
    const rnd = seededRandom(7);
    const b = Array.from({ length: 101 }, (_, i) => -5 + i * 0.1).sort(() => rnd() - 0.5);
    const even = (x: number) => 2 + 0.3 * x * x;
    const s = symmetriseOverField(b, b.map(even));
    const a = antisymmetriseOverField(b, b.map(even));
    s.absFieldT.forEach((x, i) => expect(s.values[i]).toBeCloseTo(even(x), 12));
    for (const v of a.values) expect(Math.abs(v)).toBeLessThan(1e-12);
  });

  it('interpolates each branch on a common |B| grid when ±B points differ (odd function → itself)', () => {
    const pos = [0, 0.25, 0.5, 1.0, 1.5, 2.0];
    const neg = [-0.1, -0.6, -1.2, -1.9];
    const odd = (x: number) => 0.7 * x; // linear: interpolation is exact
    const fields = [...pos, ...neg];
    const a = antisymmetriseOverField(fields, fields.map(odd));
    expect(a.grid).toMatchObject({ source: 'union-of-branches', minAbsFieldT: 0, maxAbsFieldT: 1.9, positiveBranchPoints: 6, negativeBranchPoints: 5 });
    expect(a.absFieldT).toEqual([0, 0.1, 0.25, 0.5, 0.6, 1.0, 1.2, 1.5, 1.9]);
    a.absFieldT.forEach((x, i) => expect(a.values[i]).toBeCloseTo(odd(x), 12));
    a.otherPart.forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-12));
  });

  it('uses a given grid without extrapolating and reports dropped points', () => {
    const s = symmetriseOverField([-2, -1, 0, 1, 2], [5, 2, 1, 2, 5], { gridT: [0.5, 1.5, 3] });
    expect(s.absFieldT).toEqual([0.5, 1.5]);
    expect(s.values).toEqual([1.5, 3.5]); // linear between the points
    expect(s.grid).toMatchObject({ source: 'given', droppedGridPoints: 1 });
  });

  it('averages repeated fields (up and down sweeps) and refuses one-sided data', () => {
    const s = symmetriseOverField([1, 1, -1], [1.0, 1.2, 1.3]);
    expect(s.values[0]).toBeCloseTo(1.2, 14);
    expect(() => symmetriseOverField([0.5, 1], [1, 2])).toThrow(/both positive and negative/);
  });
});
