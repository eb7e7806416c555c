import { describe, expect, it } from 'vitest';
import {
  resistivityFromBar, resistivityFromCrossSection, resistivityFromSheetResistance, resistivityFromWire,
  sheetResistanceFromBar, sheetResistanceFromResistivity,
} from '@/lib/transport/physics';
import { convertValue } from '@/lib/transport/units';

describe('resistivity and sheet resistance', () => {
  it('bar: R = 0.5 Ω, w = 1 mm, t = 100 nm, L = 2 mm → ρ = 2.5 µΩ·cm, R_s = 0.25 Ω/sq (domain.md, ρ = R·w·t/L)', () => {
    const rho = resistivityFromBar(0.5, 1e-3, 100e-9, 2e-3);
    expect(convertValue(rho, 'Ohm.m', 'uOhm.cm')).toBeCloseTo(2.5, 12);
    expect(sheetResistanceFromResistivity(rho, 100e-9)).toBeCloseTo(0.25, 12);
    expect(sheetResistanceFromBar(0.5, 1e-3, 2e-3)).toBeCloseTo(0.25, 12); // L/w = 2 squares
    expect(resistivityFromSheetResistance(0.25, 100e-9)).toBeCloseTo(2.5e-8, 20);
  });

  it('wire: ρ = R·πd²/(4L); IACS copper 1.72414 µΩ·cm: 1 m of 1 mm wire reads 21.952 mΩ (IEC 60028)', () => {
    const rIacs = (1.72414e-8 * 1) / ((Math.PI * 1e-6) / 4); // R = ρL/A
    expect(rIacs * 1e3).toBeCloseTo(21.9525, 3);
    expect(resistivityFromWire(rIacs, 1e-3, 1)).toBeCloseTo(1.72414e-8, 18);
  });

  it('general cross-section: ρ = R·A/L (definition)', () => {
    expect(resistivityFromCrossSection(2, 3e-8, 4e-3)).toBeCloseTo(1.5e-5, 18);
  });

  it('refuses non-positive geometry', () => {
    expect(() => resistivityFromBar(1, 0, 1e-7, 1e-3)).toThrow(/widthM/);
    expect(() => resistivityFromWire(1, 1e-3, -1)).toThrow(/lengthM/);
    expect(() => sheetResistanceFromResistivity(1e-8, Number.NaN)).toThrow(/thicknessM/);
  });
});
