import { UcumLhcUtils } from '@lhncbc/ucum-lhc';

// Thin wrapper so the rest of the module never touches the library's loose result objects.
let engine: UcumLhcUtils | undefined;
function ucum(): UcumLhcUtils {
  engine ??= UcumLhcUtils.getInstance();
  return engine;
}

/** The unit's display name if `code` is a valid, case-sensitive UCUM code exactly as written. */
export function ucumName(code: string): string | undefined {
  const r = ucum().validateUnitString(code);
  if (r.status !== 'valid' || r.ucumCode !== code || !r.unit) return undefined;
  return r.unit.name;
}

/** Converts one value with the library; undefined when the units are not commensurable. */
export function ucumConvert(value: number, fromUcum: string, toUcum: string): number | undefined {
  const r = ucum().convertUnitTo(fromUcum, value, toUcum);
  return r.status === 'succeeded' && typeof r.toVal === 'number' ? r.toVal : undefined;
}

/** Base-unit exponents (UCUM base units m, s, g, rad, K, C, cd), e.g. Ohm → {m:2, s:-1, g:1, C:-2}. */
export function ucumExponents(code: string): Record<string, number> | undefined {
  const r = ucum().convertToBaseUnits(code, 1);
  return r.status === 'succeeded' ? (r.unitToExp ?? {}) : undefined;
}

/** True for UCUM "special" units whose conversion is not a pure factor (Cel, [degF]). */
export function ucumIsSpecial(code: string): boolean {
  return ucum().convertToBaseUnits(code, 1).fromUnitIsSpecial === true;
}
