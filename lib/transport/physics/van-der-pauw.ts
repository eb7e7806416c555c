// van der Pauw, Philips Res. Rep. 13, 1 (1958): exp(−πR_A/R_s) + exp(−πR_B/R_s) = 1.

/** Residual of van der Pauw's equation for a trial sheet resistance (0 at the solution). */
export function vanDerPauwResidual(rAOhm: number, rBOhm: number, sheetResistanceOhmPerSq: number): number {
  return Math.exp((-Math.PI * rAOhm) / sheetResistanceOhmPerSq) + Math.exp((-Math.PI * rBOhm) / sheetResistanceOhmPerSq) - 1;
}

/**
 * Sheet resistance R_s (Ω/sq) from the two four-terminal resistances R_A, R_B of a van der Pauw plate.
 * Newton's method on g(x) = e^(−πR_A x) + e^(−πR_B x) − 1 in x = 1/R_s. g is convex and decreasing, and the start
 * x0 = 2 ln2/(π(R_A+R_B)) has g(x0) ≥ 0 (because f ≤ 1), so the iterates rise monotonically to the root: no overshoot.
 */
export function solveVanDerPauw(rAOhm: number, rBOhm: number): number {
  if (!(rAOhm > 0 && rBOhm > 0) || !Number.isFinite(rAOhm + rBOhm)) {
    throw new RangeError(`solveVanDerPauw needs two positive resistances, got R_A = ${rAOhm} Ω, R_B = ${rBOhm} Ω.`);
  }
  const a = Math.PI * rAOhm;
  const b = Math.PI * rBOhm;
  let x = (2 * Math.LN2) / (a + b); // van der Pauw (1958): R_s = π(R_A+R_B)/(2 ln2)·f with 0 < f ≤ 1
  for (let i = 0; i < 200; i++) {
    const ea = Math.exp(-a * x);
    const eb = Math.exp(-b * x);
    const step = (ea + eb - 1) / (a * ea + b * eb); // Newton: −g/g'
    if (!(step > 0)) break; // at (or a rounding hair past) the root
    x += step;
    if (step <= x * 1e-16) break;
  }
  return 1 / x;
}

/** Correction factor f(Q), Q = R_A/R_B, with R_s = π(R_A+R_B)/(2 ln2)·f; f(1) = 1, f(Q) = f(1/Q). */
export function vanDerPauwFactor(q: number): number {
  if (!(q > 0)) throw new RangeError(`vanDerPauwFactor needs Q = R_A/R_B > 0, got ${q}.`);
  return (solveVanDerPauw(q, 1) * 2 * Math.LN2) / (Math.PI * (q + 1)); // van der Pauw (1958), eq. for f
}
