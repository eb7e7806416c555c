import { formatResistivity, formatSi, sig3 } from '../format';
import type { QualityFlag, QualityRule } from '../types';

// Bounds that catch unit and geometry slips, not physics: silver, the best room-temperature conductor, has
// 1.587e-8 Ω·m at 293 K (CRC Handbook, from memory), so 1e-9 Ω·m above 200 K is at least 16× too low.
export const ROOM_T_MIN_RESISTIVITY_OHM_M = 1e-9;
export const ROOM_T_FROM_K = 200;
export const MAX_RESISTIVITY_OHM_M = 1e10;
export const CARRIER_DENSITY_RANGE_PER_M3 = { min: 1e12, max: 1e30 };
// Record 2D electron gases reach a few 1e3 m²/(V·s) (≈ 4e7 cm²/(V·s), from memory); 1e4 m²/(V·s) is beyond any.
export const MAX_MOBILITY_M2_PER_VS = 1e4;

const flag = (code: string, severity: QualityFlag['severity'], message: string, rule: string, source: string): QualityFlag => ({ code, severity, message, rule, source });

const resistivity: QualityRule = (c) => {
  const r = c.resistivityOhmM;
  if (!r) return [];
  const out: QualityFlag[] = [];
  const t = c.temperatureK;
  // Without paired points: if all data are warm, test ρ_min; if only T_max is warm, ρ_max (ρ rises with T in metals).
  const allWarm = t !== undefined && t.min >= ROOM_T_FROM_K;
  const value = allWarm ? r.min : r.max;
  if (t && t.max >= ROOM_T_FROM_K && value > 0 && value < ROOM_T_MIN_RESISTIVITY_OHM_M) {
    const what = allWarm ? `Resistivity down to ${formatResistivity(value)} at temperatures from ${sig3(t.min)} K` : `Resistivity of at most ${formatResistivity(value)} even at ${sig3(t.max)} K`;
    out.push(flag('resistivity-too-low', 'serious', `${what} is below any normal metal (silver is about 1.6 µΩ·cm at 293 K); check the geometry and its units.`,
      `ρ < ${ROOM_T_MIN_RESISTIVITY_OHM_M} Ω·m above ${ROOM_T_FROM_K} K (ρ_min if T_min ≥ ${ROOM_T_FROM_K} K, else ρ_max)`, 'CRC Handbook, "Electrical Resistivity of Pure Metals" (from memory)'));
  }
  if (r.max > MAX_RESISTIVITY_OHM_M) {
    out.push(flag('resistivity-very-high', 'warning', `Resistivity up to ${formatResistivity(r.max)} is in the range of good insulators; check that current flowed through the sample (open contact, leakage through the wiring or substrate).`,
      `ρ_max > ${sig3(MAX_RESISTIVITY_OHM_M)} Ω·m`, 'common practice'));
  }
  return out;
};

const carriers: QualityRule = (c) => {
  const n = c.carrierDensityPerM3;
  if (n === undefined) return [];
  const { min, max } = CARRIER_DENSITY_RANGE_PER_M3;
  const a = Math.abs(n);
  if (a >= min && a <= max) return [];
  return [flag('carrier-density-implausible', 'warning', `Carrier density ${sig3(a)} m⁻³ (${sig3(a * 1e-6)} cm⁻³) is outside ${sig3(min)}…${sig3(max)} m⁻³; metals are near 1e28–1e29 m⁻³. Check the thickness, the field units (1 T = 1e4 G) and the Hall voltage.`,
    `|n| outside ${sig3(min)}…${sig3(max)} m⁻³`, 'Kittel, Introduction to Solid State Physics, Table 6.1 (metal densities); common practice')];
};

const mobility: QualityRule = (c) => {
  const mu = c.mobilityM2PerVs;
  if (mu === undefined || Math.abs(mu) <= MAX_MOBILITY_M2_PER_VS) return [];
  return [flag('mobility-implausible', 'warning', `Hall mobility ${sig3(Math.abs(mu))} m²/(V·s) (${sig3(Math.abs(mu) * 1e4)} cm²/(V·s)) exceeds the best known 2D electron gases; check the field units and the sheet resistance.`,
    `|μ| > ${sig3(MAX_MOBILITY_M2_PER_VS)} m²/(V·s)`, 'common practice (record GaAs 2DEG mobilities, from memory)')];
};

const temperature: QualityRule = (c) => {
  const t = c.temperatureK;
  if (!t || !(t.min < 0)) return [];
  return [flag('negative-kelvin', 'serious', `Temperature down to ${formatSi(t.min, 'K')}: absolute temperature cannot be negative; the column is probably in °C.`,
    'T_min < 0 K', 'thermodynamic temperature is non-negative (SI definition of the kelvin)')];
};

export const implausibleValues: QualityRule = (c) => [...resistivity(c), ...carriers(c), ...mobility(c), ...temperature(c)];
