import { CATALOGUE_UCUM, fieldToTesla, unitInfo } from '@/lib/transport/units';
import type { UnitChoice } from './unit-choice';

/**
 * The UCUM catalogue of lib/transport/units as plain data for the browser, computed on the server so the UCUM engine
 * stays out of the page bundle. Values convert as the parser converts them: field-strength units (Oe, kOe, A/m) go
 * to tesla by the lab convention 1 Oe ↔ 1e-4 T and are listed with the flux-density units. Extra codes (e.g. a unit
 * a file used) are added when the catalogue knows them.
 */
export function unitCatalogue(extra: readonly string[] = []): UnitChoice[] {
  const codes = [...new Set([...CATALOGUE_UCUM, ...extra])];
  return codes.flatMap((ucum): UnitChoice[] => {
    const info = unitInfo(ucum);
    if (!info) return [];
    if (info.dimension === 'magneticFieldStrength' || info.dimension === 'magneticFluxDensity') {
      return [{ ucum, label: info.label, dimension: 'magneticFluxDensity', siUcum: 'T', factor: fieldToTesla(1, ucum), offset: 0 }];
    }
    return [{ ucum, label: info.label, dimension: info.dimension, siUcum: info.siUcum, factor: info.factor, offset: info.offset }];
  });
}
