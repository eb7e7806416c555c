import { ELEMENTARY_CHARGE_C } from './constants';

// Hall effect. Sign convention: E_y = R_H·J_x·B_z, so R_H > 0 for holes and < 0 for electrons
// (NIST Hall-effect method; ASTM F76). V_H is the transverse voltage with that sign; B in tesla.

export type CarrierType = 'holes' | 'electrons';

/** Sheet Hall coefficient R_H,s = V_H/(I·B) in m²/C (Ω/T); for a 2D layer or a film of unknown thickness. */
export function sheetHallCoefficient(hallVoltageV: number, currentA: number, fieldT: number): number {
  if (currentA === 0 || fieldT === 0) throw new RangeError('sheetHallCoefficient needs non-zero current and field.');
  return hallVoltageV / (currentA * fieldT); // R_H,s = V_H/(I·B)
}

/** Bulk Hall coefficient R_H = V_H·t/(I·B) in m³/C. */
export function hallCoefficient(hallVoltageV: number, currentA: number, fieldT: number, thicknessM: number): number {
  if (!(thicknessM > 0)) throw new RangeError(`hallCoefficient needs a positive thickness, got ${thicknessM} m.`);
  return sheetHallCoefficient(hallVoltageV, currentA, fieldT) * thicknessM; // R_H = V_H·t/(I·B)
}

/** Single-band carrier density n = 1/(e|R_H|) in m⁻³, with the carrier type from the sign of R_H. */
export function carrierDensityFromHall(hallCoefficientM3PerC: number): { densityPerM3: number; carrierType: CarrierType } {
  if (hallCoefficientM3PerC === 0 || !Number.isFinite(hallCoefficientM3PerC)) throw new RangeError('R_H must be finite and non-zero.');
  return {
    densityPerM3: 1 / (ELEMENTARY_CHARGE_C * Math.abs(hallCoefficientM3PerC)), // single-band Drude model, n = 1/(e R_H)
    carrierType: hallCoefficientM3PerC > 0 ? 'holes' : 'electrons',
  };
}

/** Single-band sheet carrier density n_s = 1/(e|R_H,s|) in m⁻², with the carrier type from the sign. */
export function sheetCarrierDensityFromHall(sheetHallCoefficientM2PerC: number): { densityPerM2: number; carrierType: CarrierType } {
  const bulk = carrierDensityFromHall(sheetHallCoefficientM2PerC); // same algebra one dimension down
  return { densityPerM2: bulk.densityPerM3, carrierType: bulk.carrierType };
}

/** Hall coefficient R_H = ±1/(n e) in m³/C for a single band of density n (m⁻³); negative for electrons. */
export function hallCoefficientFromDensity(densityPerM3: number, carrierType: CarrierType): number {
  if (!(densityPerM3 > 0)) throw new RangeError(`carrier density must be positive, got ${densityPerM3} m⁻³.`);
  const sign = carrierType === 'holes' ? 1 : -1;
  return sign / (densityPerM3 * ELEMENTARY_CHARGE_C); // Kittel, Introduction to Solid State Physics, ch. 6
}

/** Hall mobility μ_H = R_H/ρ in m²/(V·s); the sign is the carrier type (positive holes, negative electrons). */
export function hallMobility(hallCoefficientM3PerC: number, resistivityOhmM: number): number {
  if (!(resistivityOhmM > 0)) throw new RangeError(`resistivity must be positive, got ${resistivityOhmM} Ω·m.`);
  return hallCoefficientM3PerC / resistivityOhmM; // μ = R_H/ρ = R_H σ
}

/** Sheet Hall mobility μ_H = R_H,s/R_s in m²/(V·s), signed like hallMobility. */
export function sheetHallMobility(sheetHallCoefficientM2PerC: number, sheetResistanceOhmPerSq: number): number {
  if (!(sheetResistanceOhmPerSq > 0)) throw new RangeError(`sheet resistance must be positive, got ${sheetResistanceOhmPerSq} Ω/sq.`);
  return sheetHallCoefficientM2PerC / sheetResistanceOhmPerSq; // μ = 1/(e n_s R_s)
}
