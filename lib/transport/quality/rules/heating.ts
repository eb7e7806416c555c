import { jouleHeatingW } from '../../physics/joule-heating';
import { formatSi } from '../format';
import type { QualityRule } from '../types';

// Order-of-magnitude heating limits (common practice): below 1 K nanowatts warm the electrons and the stage;
// below 10 K microwatts shift a curve; at higher temperature only milliwatts matter.
export const HEATING_LIMITS: readonly { belowK: number; warningW: number; seriousW: number }[] = [
  { belowK: 1, warningW: 1e-9, seriousW: 1e-7 },
  { belowK: 10, warningW: 1e-6, seriousW: 1e-4 },
  { belowK: 77, warningW: 1e-4, seriousW: 1e-2 },
  { belowK: Infinity, warningW: 1e-2, seriousW: 1 },
];

const SAFETY = 'Excitation power also loads the cryostat and can damage thin samples; follow your local lab rules and the instrument documentation for current limits, cryogens and high fields.';

export const excitationHeating: QualityRule = (c) => {
  if (!(c.currentA && c.resistanceOhm)) return [];
  const powerW = jouleHeatingW(c.currentA, Math.abs(c.resistanceOhm.max)); // P = I²R at the largest R
  const tMin = c.temperatureK?.min;
  const limit = HEATING_LIMITS.find((l) => (tMin ?? Infinity) < l.belowK) ?? HEATING_LIMITS[HEATING_LIMITS.length - 1];
  if (powerW < limit.warningW) return [];
  const serious = powerW >= limit.seriousW;
  const where = tMin === undefined ? '' : ` at temperatures down to ${formatSi(tMin, 'K')}`;
  return [{
    code: 'excitation-heating',
    severity: serious ? 'serious' : 'warning',
    message: `Excitation of ${formatSi(c.currentA, 'A')} through up to ${formatSi(Math.abs(c.resistanceOhm.max), 'Ω')} dissipates ${formatSi(powerW, 'W')}${where}; this may heat the sample and shift the curve. Labs lower the current (and then use a lock-in).`,
    rule: `P = I²R_max ≥ ${formatSi(limit.warningW, 'W')} (warning) or ≥ ${formatSi(limit.seriousW, 'W')} (serious) for T_min < ${limit.belowK} K`,
    source: 'common practice',
    safety: SAFETY,
  }];
};
