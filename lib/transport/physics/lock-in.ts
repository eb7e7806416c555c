import { enbwBoxcar } from './enbw';

// Digital lock-in: multiply by sin and cos of the reference and average over WHOLE periods
// (Scofield, Am. J. Phys. 62, 129 (1994)). For v(t) = R·sin(2πft + θ): X = R cos θ, Y = R sin θ.

export type DemodulationInput = {
  samples: readonly number[];
  sampleRateHz: number;
  referenceHz: number;
  /** Time of the first sample relative to the reference's zero phase (s); default 0. */
  startTimeS?: number;
  /** Truncate to an integer number of reference periods (default true); false only to show the leakage. */
  wholePeriods?: boolean;
};

export type DemodulationResult = {
  x: number;
  y: number;
  r: number;
  thetaRad: number;
  thetaDeg: number;
  /** Reference periods integrated over (an integer unless wholePeriods was false). */
  periods: number;
  samplesUsed: number;
  /** Equivalent noise bandwidth of the boxcar average over the samples used, 1/(2T). */
  enbwHz: number;
};

/** Number of samples spanning the largest whole number of reference periods in `n` samples. */
function wholePeriodSamples(n: number, sampleRateHz: number, referenceHz: number): { samples: number; periods: number } {
  const samplesPerPeriod = sampleRateHz / referenceHz;
  const periods = Math.floor((n + 1e-9) / samplesPerPeriod);
  return { samples: Math.min(n, Math.round(periods * samplesPerPeriod)), periods };
}

/** Demodulates a uniformly sampled waveform at the reference frequency (X, Y, R, θ). */
export function demodulate(input: DemodulationInput): DemodulationResult {
  const { samples, sampleRateHz, referenceHz } = input;
  if (!(sampleRateHz > 0 && referenceHz > 0)) throw new RangeError('demodulate needs positive sample rate and reference frequency.');
  if (referenceHz >= sampleRateHz / 2) throw new RangeError(`reference ${referenceHz} Hz is not below the Nyquist frequency ${sampleRateHz / 2} Hz.`);
  const whole = input.wholePeriods ?? true;
  const cut = whole ? wholePeriodSamples(samples.length, sampleRateHz, referenceHz) : undefined;
  const n = cut ? cut.samples : samples.length;
  if (n < 1 || (cut && cut.periods < 1)) throw new RangeError('demodulate needs at least one whole reference period of samples.');
  const w = (2 * Math.PI * referenceHz) / sampleRateHz;
  const phase0 = 2 * Math.PI * referenceHz * (input.startTimeS ?? 0);
  let sx = 0;
  let sy = 0;
  for (let k = 0; k < n; k++) {
    const ph = phase0 + w * k;
    sx += samples[k] * Math.sin(ph);
    sy += samples[k] * Math.cos(ph);
  }
  const x = (2 * sx) / n; // factor 2: mean of sin² over whole periods is 1/2
  const y = (2 * sy) / n;
  const thetaRad = Math.atan2(y, x);
  return {
    x,
    y,
    r: Math.hypot(x, y),
    thetaRad,
    thetaDeg: (thetaRad * 180) / Math.PI,
    periods: cut ? cut.periods : (n * referenceHz) / sampleRateHz,
    samplesUsed: n,
    enbwHz: enbwBoxcar(n / sampleRateHz),
  };
}
