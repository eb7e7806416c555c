import { enbwRcCascade } from '../../physics/enbw';
import { sig3 } from '../format';
import type { QualityRule } from '../types';

// Mains pickup sits at 50/60 Hz and its harmonics; labs pick e.g. 13.7 Hz or 17.77 Hz instead (common practice).
// "On" a harmonic: within 0.05 Hz. "Near": within max(1 Hz, 2 × filter ENBW), so pickup falls inside the passband.
// Harmonics up to the 40th (2–2.4 kHz) are checked; above that, mains harmonics are usually weak.
export const MAINS_ON_HARMONIC_HZ = 0.05;
export const MAINS_NEAR_MIN_HZ = 1;
export const MAINS_MAX_HARMONIC = 40;

function nearestHarmonic(f: number, mains: readonly number[]): { mainsHz: number; k: number; distanceHz: number } {
  let best = { mainsHz: mains[0], k: 1, distanceHz: Infinity };
  for (const m of mains) {
    const k = Math.min(MAINS_MAX_HARMONIC, Math.max(1, Math.round(f / m)));
    const d = Math.abs(f - k * m);
    if (d < best.distanceHz) best = { mainsHz: m, k, distanceHz: d };
  }
  return best;
}

export const mainsHarmonic: QualityRule = (c) => {
  if (c.excitation !== 'ac' || !(c.frequencyHz && c.frequencyHz > 0)) return [];
  const mains = c.mainsHz ? [c.mainsHz] : [50, 60];
  const h = nearestHarmonic(c.frequencyHz, mains);
  const enbw = c.timeConstantS && c.timeConstantS > 0 ? enbwRcCascade(Math.max(1, Math.round(c.filterOrder ?? 1)), c.timeConstantS) : 0;
  const near = Math.max(MAINS_NEAR_MIN_HZ, 2 * enbw);
  if (h.distanceHz > near) return [];
  const on = h.distanceHz <= MAINS_ON_HARMONIC_HZ;
  const harmonic = `${h.k === 1 ? 'the' : `harmonic ${h.k} of the`} ${h.mainsHz} Hz mains (${h.k * h.mainsHz} Hz)`;
  return [{
    code: on ? 'ac-on-mains-harmonic' : 'ac-near-mains-harmonic',
    severity: on ? 'serious' : 'warning',
    message: `Excitation at ${sig3(c.frequencyHz)} Hz is ${on ? 'on' : `${sig3(h.distanceHz)} Hz from`} ${harmonic}; mains pickup is then detected as signal. Frequencies such as 13.7 Hz or 17.77 Hz avoid this.`,
    rule: `|f − k·f_mains| ≤ ${MAINS_ON_HARMONIC_HZ} Hz (serious) or ≤ max(${MAINS_NEAR_MIN_HZ} Hz, 2·ENBW) (warning), k = 1…${MAINS_MAX_HARMONIC}`,
    source: 'common practice',
  }];
};
