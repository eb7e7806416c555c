/** Magnetoresistance ratio MR = [R(B) − R(0)]/R(0), dimensionless (×100 for %). */
export function magnetoresistance(resistanceAtFieldOhm: number, resistanceAtZeroOhm: number): number {
  if (resistanceAtZeroOhm === 0) throw new RangeError('magnetoresistance needs R(0) ≠ 0.');
  return (resistanceAtFieldOhm - resistanceAtZeroOhm) / resistanceAtZeroOhm; // definition
}
