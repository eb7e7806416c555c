import { integrate } from './quadrature';

// Bloch (1930), Grüneisen (1933): phonon resistivity ρ_i(T) ∝ (T/Θ)ⁿ·J_n(Θ/T), n = 5 for electron–phonon scattering,
// J_n(u) = ∫₀ᵘ xⁿ/((eˣ − 1)(1 − e⁻ˣ)) dx = ∫₀ᵘ xⁿ/(4 sinh²(x/2)) dx.

// Beyond x = 250 the integrand (≈ xⁿ e⁻ˣ) is below 1e-90 of its peak for n ≤ 8: cutting there changes nothing.
const UPPER_CUTOFF = 250;

/** Bloch–Grüneisen integral J_n(u); J_5(∞) = 5!·ζ(5) = 124.431 331… */
export function blochGruneisenIntegral(upper: number, n = 5): number {
  if (!(upper >= 0)) throw new RangeError(`upper limit must be ≥ 0, got ${upper}.`);
  const f = (x: number) => {
    const s = Math.sinh(x / 2);
    return x ** n / (4 * s * s); // same as xⁿ eˣ/(eˣ − 1)², without cancellation at small x
  };
  return integrate(f, 0, Math.min(upper, UPPER_CUTOFF), 1);
}

/** Phonon part of ρ(T) in units of the coupling constant: (T/Θ)ⁿ·J_n(Θ/T). */
export function blochGruneisenShape(temperatureK: number, debyeTemperatureK: number, n = 5): number {
  if (!(temperatureK > 0 && debyeTemperatureK > 0)) throw new RangeError('Bloch–Grüneisen needs T > 0 K and Θ > 0 K.');
  return (temperatureK / debyeTemperatureK) ** n * blochGruneisenIntegral(debyeTemperatureK / temperatureK, n);
}

/** Ratio ρ_i(T)/ρ_i(T_ref) of the ideal (phonon) resistivity; T_ref = 273.15 K by default. */
export function blochGruneisenRatio(temperatureK: number, debyeTemperatureK: number, referenceK = 273.15, n = 5): number {
  return blochGruneisenShape(temperatureK, debyeTemperatureK, n) / blochGruneisenShape(referenceK, debyeTemperatureK, n);
}

/** Model ρ(T) = ρ₀ + C·(T/Θ)ⁿ·J_n(Θ/T) (Ω·m), with residual ρ₀ and coupling C in Ω·m (Matthiessen's rule). */
export function blochGruneisenResistivity(temperatureK: number, debyeTemperatureK: number, residualOhmM: number, couplingOhmM: number, n = 5): number {
  return residualOhmM + couplingOhmM * blochGruneisenShape(temperatureK, debyeTemperatureK, n);
}
