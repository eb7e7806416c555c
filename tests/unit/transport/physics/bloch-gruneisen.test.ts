import { describe, expect, it } from 'vitest';
import { blochGruneisenIntegral, blochGruneisenRatio, blochGruneisenResistivity, blochGruneisenShape } from '@/lib/transport/physics';

// Bloch (1930), Grüneisen (1933); values recomputed with SciPy (domain.md check table).
describe('Bloch–Grüneisen model, n = 5', () => {
  it('ρ_i(T)/ρ_i(273.15 K) with Θ = 343.5 K: 4.2 K → 1.865134e-7, 77 K → 0.1205364, 300 K → 1.114465', () => {
    expect(blochGruneisenRatio(4.2, 343.5) / 1.865134e-7).toBeCloseTo(1, 6);
    expect(blochGruneisenRatio(77, 343.5)).toBeCloseTo(0.1205364, 7);
    expect(blochGruneisenRatio(300, 343.5)).toBeCloseTo(1.114465, 6);
    expect(blochGruneisenRatio(273.15, 343.5)).toBe(1);
  });

  it('low-T limit of the integral: 5!·ζ(5) = 124.431331', () => {
    expect(blochGruneisenIntegral(1e6)).toBeCloseTo(124.431331, 6);
    expect(blochGruneisenIntegral(Infinity)).toBeCloseTo(124.431331, 6);
  });

  it('has the T⁵ law at low T and ρ ∝ T at high T (Bloch–Grüneisen limits)', () => {
    const theta = 343.5;
    expect(blochGruneisenShape(2, theta) / blochGruneisenShape(1, theta)).toBeCloseTo(32, 6);
    // Θ/T → 0: J_5(u) → u⁴/4, so (T/Θ)⁵·J_5(Θ/T) → T/(4Θ)
    expect(blochGruneisenShape(100 * theta, theta) / (100 / 4)).toBeCloseTo(1, 4);
    expect(blochGruneisenIntegral(0)).toBe(0);
  });

  it('adds a residual by Matthiessen\'s rule', () => {
    expect(blochGruneisenResistivity(300, 343.5, 1e-10, 2e-8)).toBeCloseTo(1e-10 + 2e-8 * blochGruneisenShape(300, 343.5), 22);
  });
});
