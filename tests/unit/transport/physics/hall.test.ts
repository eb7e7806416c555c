import { describe, expect, it } from 'vitest';
import {
  carrierDensityFromHall, hallCoefficient, hallCoefficientFromDensity, hallMobility, sheetCarrierDensityFromHall,
  sheetHallCoefficient, sheetHallMobility, solveVanDerPauw,
} from '@/lib/transport/physics';
import { convertValue } from '@/lib/transport/units';

describe('Hall effect', () => {
  // I = 10 µA, B = 0.5 T, V_H = 1.000 mV (domain.md; NIST Hall-effect method; ASTM F76)
  const rhs = sheetHallCoefficient(1e-3, 10e-6, 0.5);

  it('n_s = 3.120755e12 cm⁻² (NIST Hall-effect method; ASTM F76)', () => {
    const { densityPerM2, carrierType } = sheetCarrierDensityFromHall(rhs);
    expect(convertValue(densityPerM2, 'm-2', 'cm-2') / 3.120755e12).toBeCloseTo(1, 6);
    expect(carrierType).toBe('holes');
  });

  it('with t = 100 nm: R_H = 2.000e-5 m³/C and n = 3.120755e17 cm⁻³ (NIST; ASTM F76)', () => {
    const rH = hallCoefficient(1e-3, 10e-6, 0.5, 100e-9);
    expect(rH).toBeCloseTo(2e-5, 15);
    expect(convertValue(carrierDensityFromHall(rH).densityPerM3, 'm-3', 'cm-3') / 3.120755e17).toBeCloseTo(1, 6);
  });

  it('μ = 1/(e·n_s·R_s) = 44 127.12 cm²/(V·s) with R_s = 45.323601 Ω/sq (domain.md)', () => {
    const mu = sheetHallMobility(rhs, solveVanDerPauw(10, 10));
    expect(convertValue(mu, 'm2/(V.s)', 'cm2/(V.s)')).toBeCloseTo(44127.12, 1);
  });

  it('bulk mobility μ = R_H/ρ carries the sign of the carriers (Drude model)', () => {
    expect(hallMobility(2e-5, 1e-5)).toBeCloseTo(2, 12);
    expect(hallMobility(-2e-5, 1e-5)).toBeCloseTo(-2, 12);
  });

  it('Cu, n = 8.47e28 m⁻³ → R_H = −7.369e-11 m³/C (Kittel, Introduction to Solid State Physics, Table 6.1)', () => {
    const rH = hallCoefficientFromDensity(8.47e28, 'electrons');
    expect(rH / -7.369e-11).toBeCloseTo(1, 3);
    expect(carrierDensityFromHall(rH)).toEqual({ densityPerM3: expect.closeTo(8.47e28, -24), carrierType: 'electrons' });
  });

  it('refuses zero current, field or thickness', () => {
    expect(() => sheetHallCoefficient(1e-3, 0, 0.5)).toThrow(RangeError);
    expect(() => hallCoefficient(1e-3, 1e-5, 0.5, 0)).toThrow(RangeError);
    expect(() => carrierDensityFromHall(0)).toThrow(RangeError);
  });
});
