/** Display unit for noise amplitude density; UCUM cannot express √Hz, so storage is 'V2/Hz'. */
export const NOISE_DENSITY_DISPLAY_UNIT = 'V/√Hz';

/** Noise amplitude density in V/√Hz from a stored power spectral density in V²/Hz. */
export function noiseDensityDisplay(v2PerHz: number): number {
  if (!(v2PerHz >= 0)) throw new RangeError(`noiseDensityDisplay: a power spectral density cannot be ${v2PerHz} V²/Hz.`);
  return Math.sqrt(v2PerHz);
}

/** Inverse: V²/Hz to store, from an amplitude density in V/√Hz. */
export function noiseDensityToPsd(vPerRootHz: number): number {
  return vPerRootHz * vPerRootHz;
}
