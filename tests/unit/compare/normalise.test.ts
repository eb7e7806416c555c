// Normalisation by a reference value of the same curve: ρ/ρ(300 K), R/R(B = 0), y/max|y|. Expected values by hand.
import { describe, expect, it } from 'vitest';
import { normalisedLabel, referenceValue } from '@/lib/compare/normalise';

const K = { xUnit: { ucum: 'K', label: 'K', factor: 1 }, xSymbol: 'T' };
const TESLA = { xUnit: { ucum: 'T', label: 'T', factor: 1 }, xSymbol: 'B' };
const at300 = { kind: 'at-x', x: 300 } as const;

describe('ρ/ρ(300 K)', () => {
  it('interpolates linearly between the points either side of 300 K', () => {
    // Between (290 K, 4) and (310 K, 5): 4 + (5 − 4)·(300 − 290)/(310 − 290) = 4.5.
    expect(referenceValue([2, 100, 200, 290, 310], [1, 2, 3, 4, 5], at300, K)).toEqual({ ok: true, value: 4.5, note: null });
  });
  it('uses the value at 300 K itself, and averages repeated readings there (warming and cooling)', () => {
    expect(referenceValue([300, 250, 300], [6, 5, 7], at300, K)).toEqual({ ok: true, value: 6.5, note: null });
  });
  it('is not possible when the curve stops short of 300 K, and says how far it goes', () => {
    expect(referenceValue([2, 150, 280], [1, 2, 3], at300, K)).toEqual({
      ok: false, reason: 'Not possible: the curve does not reach 300 K (its T spans 2 K – 280 K).',
    });
  });
  it('takes the end point of a ramp that stops within 0.5 % of 300 K, and notes it', () => {
    expect(referenceValue([2, 150, 299.2], [1, 2, 3], at300, K)).toEqual({
      ok: true, value: 3, note: 'Reference taken at T = 299.2 K, the end of the curve nearest 300 K.',
    });
  });
  it('says nothing about an end within 0.01 % of 300 K (thermometer noise), and gives 6 digits when it does', () => {
    expect(referenceValue([2, 299.99], [1, 3], at300, K)).toEqual({ ok: true, value: 3, note: null });
    expect(referenceValue([2, 299.512], [1, 3], at300, K)).toMatchObject({ note: 'Reference taken at T = 299.512 K, the end of the curve nearest 300 K.' });
  });
  it('shows the reference in the chosen x unit (mK here)', () => {
    const mK = { xUnit: { ucum: 'mK', label: 'mK', factor: 1e-3 }, xSymbol: 'T' };
    expect(referenceValue([0.02, 0.05], [1, 2], { kind: 'at-x', x: 0.1 }, mK)).toEqual({
      ok: false, reason: 'Not possible: the curve does not reach 100 mK (its T spans 20 mK – 50 mK).',
    });
    expect(normalisedLabel({ kind: 'at-x', x: 300 }, 'ρ', K)).toBe('ρ/ρ(300 K)');
  });
  it('refuses a zero reference rather than dividing by it', () => {
    expect(referenceValue([250, 350], [0, 0], at300, K)).toEqual({ ok: false, reason: 'Not possible: the reference value is zero.' });
  });
});

describe('R/R(B = 0) of a field sweep', () => {
  it('takes the value at the field nearest zero and says where that was', () => {
    expect(referenceValue([-9, -0.01, 0.002, 9], [3, 1.1, 1.05, 3.2], { kind: 'zero-field' }, TESLA)).toEqual({
      ok: true, value: 1.05, note: 'Reference taken at B = 0.002 T, the point nearest zero.',
    });
    expect(referenceValue([0, 1, 2], [2, 3, 4], { kind: 'zero-field' }, TESLA)).toEqual({ ok: true, value: 2, note: null });
    expect(normalisedLabel({ kind: 'zero-field' }, 'R', TESLA)).toBe('R/R(B = 0)');
  });
  it('is not possible when the sweep stays away from zero (more than 2 % of its largest |B|)', () => {
    expect(referenceValue([1, 5, 9], [2, 3, 4], { kind: 'zero-field' }, TESLA)).toEqual({
      ok: false, reason: 'Not possible: the curve does not come near B = 0 (nearest point at 1 T).',
    });
  });
});

describe('y/max|y|', () => {
  it('divides by the largest magnitude, so a negative Hall curve ends at −1', () => {
    expect(referenceValue([0, 1, 2], [-4, 2, 1], { kind: 'max' }, TESLA)).toEqual({ ok: true, value: 4, note: null });
    expect(normalisedLabel({ kind: 'max' }, 'R_xy', TESLA)).toBe('R_xy/max|R_xy|');
  });
  it('ignores non-finite points and refuses an empty curve', () => {
    expect(referenceValue([0, NaN, 2], [1, 9, 2], { kind: 'max' }, K)).toEqual({ ok: true, value: 2, note: null });
    expect(referenceValue([], [], { kind: 'max' }, K)).toEqual({ ok: false, reason: 'Not possible: the curve has no points.' });
  });
});
