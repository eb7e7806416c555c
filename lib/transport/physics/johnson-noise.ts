import { BOLTZMANN_J_PER_K } from './constants';

// Johnson (1928) and Nyquist (1928), Phys. Rev. 32: open-circuit thermal noise of a resistor, classical limit hf ≪ kT.

/** Noise power spectral density 4k_B·T·R in V²/Hz. */
export function johnsonNoisePsd(temperatureK: number, resistanceOhm: number): number {
  if (!(temperatureK >= 0) || !(resistanceOhm >= 0)) throw new RangeError('Johnson noise needs T ≥ 0 K and R ≥ 0 Ω.');
  return 4 * BOLTZMANN_J_PER_K * temperatureK * resistanceOhm; // S_V = 4kTR
}

/** Noise amplitude density √(4k_B·T·R) in V/√Hz. */
export function johnsonNoiseDensity(temperatureK: number, resistanceOhm: number): number {
  return Math.sqrt(johnsonNoisePsd(temperatureK, resistanceOhm)); // √(4kTR)
}

/** RMS noise voltage √(4k_B·T·R·Δf) in V over a (noise-equivalent) bandwidth Δf in Hz. */
export function johnsonNoiseVoltage(temperatureK: number, resistanceOhm: number, bandwidthHz: number): number {
  if (!(bandwidthHz >= 0)) throw new RangeError(`bandwidth must be ≥ 0 Hz, got ${bandwidthHz}.`);
  return Math.sqrt(johnsonNoisePsd(temperatureK, resistanceOhm) * bandwidthHz); // √(4kTRΔf)
}
