import { describe, expect, it } from 'vitest';
import { BOLTZMANN_J_PER_K, ELEMENTARY_CHARGE_C, PLANCK_J_S, VON_KLITZING_OHM, ZERO_CELSIUS_K } from '@/lib/transport/physics';

describe('CODATA 2018 exact constants', () => {
  it('match the SI defining values (CODATA 2018 / SI Brochure 9th ed.)', () => {
    expect(ELEMENTARY_CHARGE_C).toBe(1.602176634e-19);
    expect(BOLTZMANN_J_PER_K).toBe(1.380649e-23);
    expect(PLANCK_J_S).toBe(6.62607015e-34);
    expect(ZERO_CELSIUS_K).toBe(273.15);
  });

  it('give h/e² = 25 812.807459 Ω (CODATA 2018, von Klitzing constant)', () => {
    expect(VON_KLITZING_OHM).toBeCloseTo(25812.807459, 6);
  });
});
