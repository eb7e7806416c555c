/** Power dissipated in the sample, P = I²R (W); for AC use the RMS current. */
export function jouleHeatingW(currentA: number, resistanceOhm: number): number {
  return currentA * currentA * resistanceOhm; // Joule's law
}

/** Power dissipated at a voltage across R, P = V²/R (W). */
export function jouleHeatingFromVoltageW(voltageV: number, resistanceOhm: number): number {
  if (resistanceOhm === 0) throw new RangeError('jouleHeatingFromVoltageW needs R ≠ 0.');
  return (voltageV * voltageV) / Math.abs(resistanceOhm); // P = V²/R
}
