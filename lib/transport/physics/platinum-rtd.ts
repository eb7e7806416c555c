import { ZERO_CELSIUS_K } from './constants';

// Platinum resistance thermometers, Callendar–Van Dusen equation with the IEC 60751 coefficients:
// R(t) = R0·[1 + A·t + B·t² + C·(t − 100)·t³], t in °C, C = 0 for t ≥ 0 °C.

export type CallendarVanDusen = { a: number; b: number; c: number };

/** IEC 60751 coefficients (A in °C⁻¹, B in °C⁻², C in °C⁻⁴, C used below 0 °C only). */
export const IEC_60751_COEFFICIENTS: Readonly<CallendarVanDusen> = { a: 3.9083e-3, b: -5.775e-7, c: -4.183e-12 };
export const PT100_R0_OHM = 100;
export const PT1000_R0_OHM = 1000;
/** Range over which IEC 60751 defines the equation, −200 °C … 850 °C. */
export const IEC_60751_RANGE_K = { min: ZERO_CELSIUS_K - 200, max: ZERO_CELSIUS_K + 850 } as const;

function ratioAt(tC: number, k: CallendarVanDusen): number {
  const cTerm = tC < 0 ? k.c * (tC - 100) * tC * tC * tC : 0;
  return 1 + k.a * tC + k.b * tC * tC + cTerm; // IEC 60751, Callendar–Van Dusen
}

/** Sensor resistance (Ω) at a temperature (K); R0 = 100 Ω for Pt100, 1000 Ω for Pt1000. */
export function platinumResistanceOhm(temperatureK: number, r0Ohm = PT100_R0_OHM, k: CallendarVanDusen = IEC_60751_COEFFICIENTS): number {
  return r0Ohm * ratioAt(temperatureK - ZERO_CELSIUS_K, k);
}

/** Temperature (K) from a sensor resistance (Ω): closed form at or above 0 °C, Newton on the full equation below. */
export function platinumTemperatureK(resistanceOhm: number, r0Ohm = PT100_R0_OHM, k: CallendarVanDusen = IEC_60751_COEFFICIENTS): number {
  if (!(resistanceOhm > 0) || !(r0Ohm > 0)) throw new RangeError('platinumTemperatureK needs positive R and R0.');
  const r = resistanceOhm / r0Ohm;
  // Root of B t² + A t + (1 − r) = 0 in the cancellation-free form 2(r−1)/(A + √(A² + 4B(r−1))).
  const disc = k.a * k.a + 4 * k.b * (r - 1);
  if (disc < 0) throw new RangeError(`R = ${resistanceOhm} Ω lies beyond the maximum of the Callendar–Van Dusen curve.`);
  let t = (2 * (r - 1)) / (k.a + Math.sqrt(disc));
  if (r < 1) {
    for (let i = 0; i < 50; i++) {
      const f = ratioAt(t, k) - r;
      const df = k.a + 2 * k.b * t + k.c * (4 * t * t * t - 300 * t * t); // d/dt of the C term (t⁴ − 100t³)
      const step = f / df;
      t -= step;
      if (Math.abs(step) < 1e-14) break;
    }
  }
  return t + ZERO_CELSIUS_K;
}
