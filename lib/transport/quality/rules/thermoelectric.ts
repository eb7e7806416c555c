import { formatSi } from '../format';
import type { QualityRule } from '../types';

// Thermoelectric EMFs at junctions are typically 0.1–10 µV in a cryostat (common practice): they do not flip with
// the current, so plain DC readings below ~1 mV carry them as an error; below 10 µV they may dominate.
export const THERMO_WARNING_BELOW_V = 1e-3;
export const THERMO_SERIOUS_BELOW_V = 1e-5;

export const dcWithoutReversal: QualityRule = (c) => {
  if (c.excitation !== 'dc' || !c.voltageV) return [];
  const v = Math.max(Math.abs(c.voltageV.min), Math.abs(c.voltageV.max));
  if (v >= THERMO_WARNING_BELOW_V) return [];
  const serious = v < THERMO_SERIOUS_BELOW_V;
  return [{
    code: 'dc-without-reversal',
    severity: serious ? 'serious' : 'warning',
    message: `DC readings without current reversal, with signals of at most ${formatSi(v, 'V')}: thermoelectric offsets of order a microvolt do not flip with the current and stay in the data. Reversal averaging (V₊ − V₋)/2, a +,−,+ delta, or AC with a lock-in removes them.`,
    rule: `excitation 'dc' and max |V| < ${formatSi(THERMO_SERIOUS_BELOW_V, 'V')} (serious) or < ${formatSi(THERMO_WARNING_BELOW_V, 'V')} (warning)`,
    source: 'common practice (delta method)',
  }];
};
