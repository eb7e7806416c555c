// Equivalent noise bandwidth (ENBW) and settling of lock-in output filters.

/**
 * ENBW (Hz) of n cascaded identical RC low-pass stages of time constant τ: Γ(n−½)/(4√π Γ(n) τ).
 * Evaluated exactly as C(2n−2, n−1)/(4ⁿ τ) via the recurrence Γ(n+½)/Γ(n+1) = Γ(n−½)/Γ(n)·(2n−1)/(2n).
 */
export function enbwRcCascade(order: number, timeConstantS: number): number {
  if (!Number.isInteger(order) || order < 1) throw new RangeError(`filter order must be a positive integer, got ${order}.`);
  if (!(timeConstantS > 0)) throw new RangeError(`time constant must be positive, got ${timeConstantS} s.`);
  let ratio = 1; // Γ(n−½)/(√π Γ(n)) at n = 1
  for (let n = 2; n <= order; n++) ratio *= (2 * n - 3) / (2 * n - 2);
  return ratio / (4 * timeConstantS); // standard result, ∫|H(f)|² df for |H|² = (1+(2πfτ)²)^(−n)
}

/** ENBW (Hz) of a boxcar average (uniform integration) over a time T: 1/(2T). */
export function enbwBoxcar(averagingTimeS: number): number {
  if (!(averagingTimeS > 0)) throw new RangeError(`averaging time must be positive, got ${averagingTimeS} s.`);
  return 1 / (2 * averagingTimeS); // ∫ sinc²(πfT) df from 0 to ∞ = 1/(2T)
}

/** Step response of n cascaded RC stages at time t: 1 − e^(−t/τ) Σ_{k<n} (t/τ)^k/k! (Erlang CDF). */
export function rcCascadeStepResponse(order: number, timeConstantS: number, timeS: number): number {
  const u = timeS / timeConstantS;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < order; k++) {
    term *= u / k;
    sum += term;
  }
  return 1 - Math.exp(-u) * sum; // Laplace inverse of 1/(s(1+sτ)ⁿ)
}

/** Time (s) for n cascaded RC stages to settle to within `fraction` of a step (e.g. 0.01 → 99 %). */
export function rcCascadeSettlingTime(order: number, timeConstantS: number, fraction = 0.01): number {
  if (!(fraction > 0 && fraction < 1)) throw new RangeError(`fraction must lie in (0, 1), got ${fraction}.`);
  let lo = 0;
  let hi = timeConstantS;
  while (rcCascadeStepResponse(order, timeConstantS, hi) < 1 - fraction) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (rcCascadeStepResponse(order, timeConstantS, mid) < 1 - fraction) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2; // bisection: the step response rises monotonically
}
