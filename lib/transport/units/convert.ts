import { unitInfo, type UnitInfo } from './unit-info';

/** Thrown when a unit is unknown or two units are not of the same dimension; names both units. */
export class UnitConversionError extends Error {
  constructor(
    message: string,
    readonly fromUcum: string,
    readonly toUcum: string,
  ) {
    super(message);
    this.name = 'UnitConversionError';
  }
}

function requireUnit(ucum: string, fromUcum: string, toUcum: string): UnitInfo {
  const info = unitInfo(ucum);
  if (!info) {
    throw new UnitConversionError(
      `Cannot convert from '${fromUcum}' to '${toUcum}': '${ucum}' is not a UCUM code Ohmstead knows (codes are case-sensitive).`,
      fromUcum,
      toUcum,
    );
  }
  return info;
}

/** Value in the unit's SI unit (unitInfo(ucum).siUcum). */
export function toSi(value: number, ucum: string): number {
  const info = requireUnit(ucum, ucum, 'SI');
  return value * info.factor + info.offset;
}

/** Value in `ucum` from a value in its SI unit. */
export function fromSi(value: number, ucum: string): number {
  const info = requireUnit(ucum, 'SI', ucum);
  return (value - info.offset) / info.factor;
}

/** Converts between two units of the same dimension; throws UnitConversionError otherwise. */
export function convertValue(value: number, fromUcum: string, toUcum: string): number {
  const from = requireUnit(fromUcum, fromUcum, toUcum);
  const to = requireUnit(toUcum, fromUcum, toUcum);
  if (fromUcum === toUcum) return value;
  if (from.dimension !== to.dimension) {
    const hint =
      [from.dimension, to.dimension].sort().join() === 'magneticFieldStrength,magneticFluxDensity'
        ? ' B and H differ in dimension; use fieldToTesla for the lab convention 1 Oe ↔ 1e-4 T.'
        : '';
    throw new UnitConversionError(
      `Cannot convert from '${fromUcum}' (${from.dimension}, ${from.siUcum}) to '${toUcum}' (${to.dimension}, ${to.siUcum}): incompatible units.${hint}`,
      fromUcum,
      toUcum,
    );
  }
  return (value * from.factor + from.offset - to.offset) / to.factor;
}
