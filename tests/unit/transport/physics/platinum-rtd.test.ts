import { describe, expect, it } from 'vitest';
import { IEC_60751_RANGE_K, PT1000_R0_OHM, platinumResistanceOhm, platinumTemperatureK } from '@/lib/transport/physics';

const K = (celsius: number) => celsius + 273.15;

describe('Pt100 / Pt1000, Callendar–Van Dusen (IEC 60751)', () => {
  it('R(−200/−100/0/100/200/500/850 °C) = 18.5201/60.2558/100/138.5055/175.8560/280.9775/390.4811 Ω (IEC 60751)', () => {
    const table: [number, number][] = [[-200, 18.5201], [-100, 60.2558], [0, 100], [100, 138.5055], [200, 175.856], [500, 280.9775], [850, 390.4811]];
    for (const [t, r] of table) {
      expect(platinumResistanceOhm(K(t)), `${t} °C`).toBeCloseTo(r, 4);
      expect(platinumTemperatureK(r) - 273.15, `${r} Ω`).toBeCloseTo(t, 2); // table rounded to 0.1 mΩ ≈ 0.3 mK
    }
  });

  it('Pt1000 is ten times Pt100 (IEC 60751)', () => {
    expect(platinumResistanceOhm(K(100), PT1000_R0_OHM)).toBeCloseTo(1385.055, 3);
    expect(platinumTemperatureK(1385.055, PT1000_R0_OHM) - 273.15).toBeCloseTo(100, 4);
  });

  it('T → R → T round-trips to 1e-9 K over −200…850 °C, both sides of 0 °C', () => {
    for (let t = -200; t <= 850; t += 0.37) {
      const back = platinumTemperatureK(platinumResistanceOhm(K(t)));
      expect(Math.abs(back - K(t)), `${t} °C`).toBeLessThan(1e-9);
    }
    for (const t of [-1e-6, 0, 1e-6]) expect(Math.abs(platinumTemperatureK(platinumResistanceOhm(K(t))) - K(t))).toBeLessThan(1e-9);
    expect(IEC_60751_RANGE_K.min).toBeCloseTo(73.15, 12);
    expect(IEC_60751_RANGE_K.max).toBeCloseTo(1123.15, 12);
  });

  it('refuses a non-positive resistance', () => {
    expect(() => platinumTemperatureK(0)).toThrow(RangeError);
  });
});
