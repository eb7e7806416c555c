// DC current reversal: the thermoelectric offset does not flip with the current, so it cancels (common practice).

/** Offset-free voltage (V₊ − V₋)/2 from readings at +I and −I. */
export function reversalAverage(vPlusV: number, vMinusV: number): number {
  return (vPlusV - vMinusV) / 2; // offset V_th cancels: ((V+V_th) − (−V+V_th))/2 = V
}

/** Resistance R = (V₊ − V₋)/(2I) from readings at +I and −I (I is the magnitude of the current). */
export function resistanceFromReversal(vPlusV: number, vMinusV: number, currentA: number): number {
  if (currentA === 0) throw new RangeError('resistanceFromReversal needs a non-zero current.');
  return reversalAverage(vPlusV, vMinusV) / currentA;
}

/** Three-reading delta (+, −, +): [(V₁ + V₃)/2 − V₂]/2 cancels a constant offset and a linear drift. */
export function threeReadingDelta(v1PlusV: number, v2MinusV: number, v3PlusV: number): number {
  return (v1PlusV - 2 * v2MinusV + v3PlusV) / 4; // with V_i = ±V + a + d·i the a and d terms cancel
}

/** Running three-point deltas over readings taken with alternating current sign, the first at +I. */
export function deltaSeries(alternatingReadingsV: readonly number[]): number[] {
  const out: number[] = [];
  for (let i = 0; i + 2 < alternatingReadingsV.length; i++) {
    const sign = i % 2 === 0 ? 1 : -1; // windows starting on a −I reading give −V
    out.push(sign * threeReadingDelta(alternatingReadingsV[i], alternatingReadingsV[i + 1], alternatingReadingsV[i + 2]));
  }
  return out;
}
