import { describe, expect, it } from 'vitest';
import {
  OERSTED_TO_TESLA_CONVENTION, fieldToTesla, isAmplitudeDensityText, noiseDensityDisplay, noiseDensityToPsd, teslaToField,
} from '@/lib/transport/units';

describe('B ↔ H lab convention', () => {
  it('is 1 Oe ↔ 1e-4 T (domain.md "Units": μ0·H in vacuum, lab convention)', () => {
    expect(OERSTED_TO_TESLA_CONVENTION).toBe(1e-4);
    expect(fieldToTesla(1, 'Oe')).toBe(1e-4);
    expect(fieldToTesla(10, 'kOe')).toBeCloseTo(1, 14);
  });

  it('converts flux-density units exactly (1 G = 1e-4 T, SI Brochure Table 9)', () => {
    expect(fieldToTesla(1, 'T')).toBe(1);
    expect(fieldToTesla(500, 'mT')).toBeCloseTo(0.5, 15);
    expect(fieldToTesla(5000, 'G')).toBeCloseTo(0.5, 15);
  });

  it('treats A/m with μ0 = 4π·1e-7 T·m/A, consistent with 1 Oe = 1000/(4π) A/m', () => {
    expect(fieldToTesla(1000 / (4 * Math.PI), 'A/m')).toBeCloseTo(1e-4, 15);
    expect(fieldToTesla(1, 'A/m')).toBeCloseTo(4 * Math.PI * 1e-7, 18);
  });

  it('inverts (round trip)', () => {
    for (const u of ['T', 'mT', 'G', 'Oe', 'kOe', 'A/m']) expect(fieldToTesla(teslaToField(0.75, u), u)).toBeCloseTo(0.75, 12);
    expect(teslaToField(1, 'kOe')).toBeCloseTo(10, 12);
  });

  it('refuses non-field units', () => {
    expect(() => fieldToTesla(1, 'K')).toThrow(/not a magnetic field unit/);
  });
});

describe('noise density display', () => {
  it('shows √(V²/Hz) as V/√Hz: 1.6567788e-17 V²/Hz → 4.070355 nV/√Hz (1 kΩ, 300 K, Johnson–Nyquist 1928)', () => {
    expect(noiseDensityDisplay(1.6567788e-17) * 1e9).toBeCloseTo(4.070355, 6);
    expect(noiseDensityToPsd(noiseDensityDisplay(2.5e-18))).toBeCloseTo(2.5e-18, 30);
    expect(() => noiseDensityDisplay(-1)).toThrow(RangeError);
  });

  it('recognises amplitude-density text that UCUM cannot store', () => {
    expect(isAmplitudeDensityText('nV/√Hz')).toBe(true);
    expect(isAmplitudeDensityText('V/sqrt(Hz)')).toBe(true);
    expect(isAmplitudeDensityText('V/rtHz')).toBe(true);
    expect(isAmplitudeDensityText('V^2/Hz')).toBe(false);
  });
});
