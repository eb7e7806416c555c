import { formatSi } from '../format';
import type { QualityRule } from '../types';

// Cryostat wiring and contacts add ohms to tens of ohms in series (common practice), so below 1 kΩ a two-wire
// reading can be off by percents or more; up to 100 kΩ by a fraction of a percent.
export const TWO_WIRE_SERIOUS_BELOW_OHM = 1e3;
export const TWO_WIRE_WARNING_BELOW_OHM = 1e5;

export const twoWireLowResistance: QualityRule = (c) => {
  if (c.mode !== 'two-wire' || !c.resistanceOhm) return [];
  const r = Math.abs(c.resistanceOhm.max);
  if (r >= TWO_WIRE_WARNING_BELOW_OHM) return [];
  const serious = r < TWO_WIRE_SERIOUS_BELOW_OHM;
  return [{
    code: 'two-wire-low-resistance',
    severity: serious ? 'serious' : 'warning',
    message: `Two-wire measurement of a sample of at most ${formatSi(r, 'Ω')}: the reading includes leads and contacts, which are often ohms or more. A four-wire (Kelvin) measurement reads the sample alone.`,
    rule: `two-wire with max |R| < ${formatSi(TWO_WIRE_SERIOUS_BELOW_OHM, 'Ω')} (serious) or < ${formatSi(TWO_WIRE_WARNING_BELOW_OHM, 'Ω')} (warning)`,
    source: 'common practice (four-wire is standard for low and moderate resistances)',
  }];
};

export const negativeResistance: QualityRule = (c) => {
  if (!c.resistanceOhm || !(c.resistanceOhm.min < 0)) return [];
  if (c.mode === 'two-wire') {
    return [{
      code: 'negative-two-wire-resistance',
      severity: 'serious',
      message: `Two-wire resistance goes down to ${formatSi(c.resistanceOhm.min, 'Ω')}: a passive two-terminal resistance cannot be negative. Check the sign of current or voltage and any offset subtraction.`,
      rule: 'two-wire with min R < 0',
      source: 'common practice (passivity of a two-terminal resistor)',
    }];
  }
  return [{
    code: 'negative-four-wire-resistance',
    severity: 'info',
    message: `Four-wire resistance goes down to ${formatSi(c.resistanceOhm.min, 'Ω')}. This can be genuine: misaligned voltage contacts pick up Hall voltage, current paths can be non-uniform, and a superconducting sample reads noise around zero. Check it is expected.`,
    rule: 'four-wire (or unknown mode) with min R < 0',
    source: 'common practice',
  }];
};
