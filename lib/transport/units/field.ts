import { convertValue } from './convert';
import { unitInfo } from './unit-info';

/**
 * Lab convention for magnetic field: 1 Oe of H is reported as 1e-4 T of B (B = μ0·H in vacuum, CGS μ0 = 1).
 * Oersted (H, A/m) and tesla (B) differ in dimension, so this is a convention, not a unit conversion:
 * 1 Oe = 1000/(4π) A/m exactly, and μ0·(1 Oe) = 1.00000000055e-4 T with the CODATA 2018 μ0. We use the
 * exact lab value 1e-4 (i.e. μ0 taken as 4π·1e-7 T·m/A). Gauss → tesla (1 G = 1e-4 T) is exact, same dimension.
 */
export const OERSTED_TO_TESLA_CONVENTION = 1e-4;

/** Magnetic field in tesla from a flux-density unit (T, mT, G, …) exactly, or a field-strength unit (Oe, kOe, A/m) by the convention above. */
export function fieldToTesla(value: number, ucum: string): number {
  const info = unitInfo(ucum);
  if (info?.dimension === 'magneticFluxDensity') return convertValue(value, ucum, 'T');
  if (info?.dimension === 'magneticFieldStrength') return convertValue(value, ucum, 'Oe') * OERSTED_TO_TESLA_CONVENTION;
  throw new Error(`fieldToTesla: '${ucum}' is not a magnetic field unit (expected e.g. T, mT, G, Oe, kOe, A/m).`);
}

/** Inverse of fieldToTesla: a value in tesla expressed in `ucum` (flux density exactly, field strength by convention). */
export function teslaToField(valueT: number, ucum: string): number {
  const info = unitInfo(ucum);
  if (info?.dimension === 'magneticFluxDensity') return convertValue(valueT, 'T', ucum);
  if (info?.dimension === 'magneticFieldStrength') return convertValue(valueT / OERSTED_TO_TESLA_CONVENTION, 'Oe', ucum);
  throw new Error(`teslaToField: '${ucum}' is not a magnetic field unit (expected e.g. T, mT, G, Oe, kOe, A/m).`);
}
