import { interpolateLinear, sortedCurve } from './interpolate';

// Residual resistivity ratio, RRR = ρ(T_high)/ρ(T_low): Splett et al., J. Res. NIST 116, 489 (2011); IEC 61788-4.

export type RrrReference = {
  requestedK: number;
  /** The temperature whose value entered the ratio (the requested one, or the nearest measured end when held). */
  usedK: number;
  value: number;
  extrapolated: boolean;
};

export type RrrResult = { rrr: number; high: RrrReference; low: RrrReference };

export type RrrOptions = {
  /** Upper reference; by default 273 K if the data reach it, else 300 K if they do, else whichever is nearer. */
  highK?: number;
  /** Lower reference, default 4.2 K (liquid helium). */
  lowK?: number;
};

function pickHighK(minK: number, maxK: number): number {
  for (const t of [273, 300]) if (t >= minK && t <= maxK) return t;
  return Math.abs(maxK - 273) <= Math.abs(maxK - 300) ? 273 : 300;
}

/**
 * RRR from a ρ(T) (or R(T)) curve, interpolated linearly at both references. Above the data the end segment is
 * extrapolated linearly (ρ ∝ T near room temperature); below the data the lowest value is held (residual plateau).
 */
export function residualResistivityRatio(temperatureK: readonly number[], resistivity: readonly number[], options: RrrOptions = {}): RrrResult {
  const curve = sortedCurve(temperatureK, resistivity);
  if (curve.x.length < 2) throw new RangeError('RRR needs at least two temperatures.');
  const minK = curve.x[0];
  const maxK = curve.x[curve.x.length - 1];
  const highK = options.highK ?? pickHighK(minK, maxK);
  const lowK = options.lowK ?? 4.2;
  const high: RrrReference = { requestedK: highK, usedK: highK, value: interpolateLinear(curve, highK), extrapolated: highK > maxK || highK < minK };
  const lowHeld = lowK < minK;
  const low: RrrReference = {
    requestedK: lowK,
    usedK: lowHeld ? minK : lowK,
    value: lowHeld ? curve.y[0] : interpolateLinear(curve, lowK),
    extrapolated: lowHeld || lowK > maxK,
  };
  return { rrr: high.value / low.value, high, low };
}
