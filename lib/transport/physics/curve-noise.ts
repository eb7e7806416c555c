import { johnsonNoiseVoltage } from './johnson-noise';

// Noise of measured curves, in the units of the values (volts when the values are voltages).

export type ScatterResult = { sigma: number; pointsUsed: number; estimator: 'second-difference' };

/**
 * Point-to-point scatter of a sweep: for each interior point, the residual from the straight line through its two
 * neighbours, r_i = y_i − (b_i·y_{i−1} + a_i·y_{i+1}), has variance σ²(1 + a_i² + b_i²) for white noise σ while a
 * smooth curve cancels to first order. σ is the sample standard deviation of r_i/√(1+a_i²+b_i²); the mean is removed
 * so constant curvature does not count as noise. With even spacing this is std(second differences)/√6.
 * Chosen because it needs no model of the curve and no smoothing window (common practice for sweep noise).
 * null when fewer than two residuals can be formed: too few points, neighbours at the same x, or non-finite values.
 */
export function pointToPointScatter(values: readonly number[], x?: readonly number[]): ScatterResult | null {
  if (x && x.length !== values.length) throw new RangeError(`values and x differ in length (${values.length} vs ${x.length}).`);
  const z: number[] = [];
  for (let i = 1; i + 1 < values.length; i++) {
    let a = 0.5; // weight of the right neighbour; b = 1 − a for the left one
    if (x) {
      const span = x[i + 1] - x[i - 1];
      if (span === 0) continue;
      a = (x[i] - x[i - 1]) / span;
    }
    const b = 1 - a;
    const r = values[i] - (b * values[i - 1] + a * values[i + 1]); // linear interpolation from the neighbours
    if (Number.isFinite(r)) z.push(r / Math.sqrt(1 + a * a + b * b));
  }
  if (z.length < 2) return null;
  let sum = 0;
  for (let i = 0; i < z.length; i++) sum += z[i];
  const mean = sum / z.length;
  let squares = 0;
  for (let i = 0; i < z.length; i++) squares += (z[i] - mean) ** 2;
  const variance = squares / (z.length - 1);
  return { sigma: Math.sqrt(variance), pointsUsed: z.length + 2, estimator: 'second-difference' };
}

export type AllanResult = { clusterSize: number; tauS?: number; deviation: number; terms: number; overlapping: boolean };

/**
 * Allan deviation of readings repeated at fixed conditions, for averaging clusters of m readings.
 * Overlapping estimator by default (IEEE Std 1139; Riley, NIST SP 1065, eq. 10): it uses every cluster start, so it
 * has better confidence than the non-overlapping one at the same m. For white noise σ_A(m) = σ/√m; a drift makes
 * σ_A grow with m, which is how it tells noise from drift.
 */
export function allanDeviation(values: readonly number[], clusterSize = 1, options: { overlapping?: boolean; intervalS?: number } = {}): AllanResult {
  const m = clusterSize;
  const n = values.length;
  const overlapping = options.overlapping ?? true;
  if (!Number.isInteger(m) || m < 1 || n < 2 * m) throw new RangeError(`Allan deviation needs an integer cluster size ≥ 1 and at least 2m readings (m = ${m}, N = ${n}).`);
  const prefix = [0];
  for (const v of values) prefix.push(prefix[prefix.length - 1] + v);
  const mean = (start: number) => (prefix[start + m] - prefix[start]) / m; // average of m readings from `start`
  const step = overlapping ? 1 : m;
  let sum = 0;
  let terms = 0;
  for (let j = 0; j + 2 * m <= n; j += step) {
    sum += (mean(j + m) - mean(j)) ** 2;
    terms++;
  }
  const tauS = options.intervalS !== undefined ? m * options.intervalS : undefined;
  return { clusterSize: m, tauS, deviation: Math.sqrt(sum / (2 * terms)), terms, overlapping }; // σ² = ½⟨(ȳ_{k+1} − ȳ_k)²⟩
}

/** Allan deviations at octave-spaced cluster sizes m = 1, 2, 4, … up to N/2. */
export function allanDeviationCurve(values: readonly number[], options: { overlapping?: boolean; intervalS?: number } = {}): AllanResult[] {
  const out: AllanResult[] = [];
  for (let m = 1; 2 * m <= values.length; m *= 2) out.push(allanDeviation(values, m, options));
  return out;
}

export type JohnsonComparison = { noiseV: number; johnsonFloorV: number; ratio: number };

/** A measured RMS noise (V) against the Johnson–Nyquist floor √(4kTRΔf) for the sample's R, T and detection bandwidth. */
export function compareToJohnsonFloor(noiseV: number, resistanceOhm: number, temperatureK: number, bandwidthHz: number): JohnsonComparison {
  const johnsonFloorV = johnsonNoiseVoltage(temperatureK, Math.abs(resistanceOhm), bandwidthHz); // Johnson–Nyquist (1928)
  return { noiseV, johnsonFloorV, ratio: noiseV / johnsonFloorV };
}
