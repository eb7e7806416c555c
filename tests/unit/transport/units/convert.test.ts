import { describe, expect, it } from 'vitest';
import { UnitConversionError, convertValue, fromSi, toSi } from '@/lib/transport/units';

describe('toSi / fromSi / convertValue', () => {
  it('converts the bar check value: 2.5 µΩ·cm = 2.5e-8 Ω·m (domain.md check table, definition)', () => {
    expect(convertValue(2.5, 'uOhm.cm', 'Ohm.m')).toBeCloseTo(2.5e-8, 20);
    expect(convertValue(2.5e-8, 'Ohm.m', 'uOhm.cm')).toBeCloseTo(2.5, 12);
  });

  it('converts carrier densities and mobilities (SI prefixes, exact)', () => {
    expect(convertValue(3.120755e17, 'cm-3', 'm-3') / 3.120755e23).toBeCloseTo(1, 14);
    expect(convertValue(3.120755e12, 'cm-2', 'm-2') / 3.120755e16).toBeCloseTo(1, 14);
    expect(convertValue(44127.12, 'cm2/(V.s)', 'm2/(V.s)')).toBeCloseTo(4.412712, 12);
    expect(convertValue(2e-5, 'm3/C', 'cm3/C')).toBeCloseTo(20, 10);
  });

  it('converts temperatures with offsets (SI Brochure: T/K = t/°C + 273.15)', () => {
    expect(toSi(25, 'Cel')).toBeCloseTo(298.15, 12);
    expect(fromSi(273.15, 'Cel')).toBe(0);
    expect(convertValue(-40, 'Cel', '[degF]')).toBeCloseTo(-40, 10); // the scales cross at −40 (NIST SP 811)
    expect(convertValue(1500, 'mK', 'K')).toBeCloseTo(1.5, 14);
  });

  it('converts G to T exactly (1 G = 1e-4 T, SI Brochure 9th ed., Table 9)', () => {
    expect(convertValue(1, 'G', 'T')).toBe(1e-4);
    expect(convertValue(250, 'mT', 'G')).toBeCloseTo(2500, 10);
  });

  it('converts angles, times and rates', () => {
    expect(convertValue(180, 'deg', 'rad')).toBeCloseTo(Math.PI, 14);
    expect(convertValue(2, 'h', 'min')).toBeCloseTo(120, 12);
    expect(convertValue(1, 'K/min', 'K/s')).toBeCloseTo(1 / 60, 15);
    expect(convertValue(0.5, 'T/min', 'mT/s')).toBeCloseTo(500 / 60, 12);
    expect(convertValue(50, '%', '1')).toBeCloseTo(0.5, 15);
  });

  it('returns the value unchanged for identical units', () => {
    expect(convertValue(1.23456789, 'kOhm', 'kOhm')).toBe(1.23456789);
  });

  it('refuses incompatible units and names both, with the B/H hint for Oe → T', () => {
    expect(() => convertValue(1, 'Oe', 'T')).toThrow(UnitConversionError);
    expect(() => convertValue(1, 'Oe', 'T')).toThrow(/'Oe'.*'T'.*fieldToTesla/);
    expect(() => convertValue(1, 'Ohm', 'Ohm.m')).toThrow(/'Ohm' \(resistance, Ohm\) to 'Ohm.m' \(resistivity, Ohm.m\)/);
    expect(() => convertValue(1, 'Ohm', 'Ohm/{sq}')).toThrow(/sheetResistance/);
  });

  it('refuses unknown units and names both', () => {
    expect(() => convertValue(1, 'ohms', 'Ohm')).toThrow(/from 'ohms' to 'Ohm'.*'ohms' is not a UCUM code/);
    expect(() => convertValue(1, 'V', 'volt')).toThrow(/from 'V' to 'volt'/);
    expect(() => toSi(1, 'furlong-ish')).toThrow(UnitConversionError);
  });
});
