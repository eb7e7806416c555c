import { DIMENSIONS, SI_UCUM, type Dimension } from './dimensions';
import { labelFromUcum } from './label';
import { ucumConvert, ucumExponents, ucumIsSpecial, ucumName } from './ucum-engine';

/** One unit: SI value = value · factor + offset (offset is non-zero only for Cel and [degF]). */
export type UnitInfo = {
  ucum: string;
  label: string;
  dimension: Dimension;
  siUcum: string;
  factor: number;
  offset: number;
};

// 15 significant digits removes the library's last-bit noise (cm-3 → 999999.9999999999) and keeps all real precision.
const round15 = (x: number): number => Number(x.toPrecision(15));

let dimensionExponents: Map<Dimension, Record<string, number>> | undefined;
function exponentsByDimension(): Map<Dimension, Record<string, number>> {
  dimensionExponents ??= new Map(DIMENSIONS.map((d) => [d, ucumExponents(SI_UCUM[d]) ?? {}]));
  return dimensionExponents;
}

function sameExponents(a: Record<string, number>, b: Record<string, number>): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  return [...keys].every((k) => (a[k] ?? 0) === (b[k] ?? 0));
}

function dimensionOf(ucum: string): Dimension | undefined {
  const exps = ucumExponents(ucum);
  if (!exps) return undefined;
  for (const [dim, dimExps] of exponentsByDimension()) {
    if (!sameExponents(exps, dimExps)) continue;
    // UCUM ignores annotations, so Ω and Ω/{sq} share exponents; the annotation decides.
    if (dim === 'resistance' && ucum.includes('{sq}')) return 'sheetResistance';
    return dim;
  }
  return undefined;
}

function build(ucum: string): UnitInfo | undefined {
  // The library logs to the console on blanks; a UCUM code never contains whitespace.
  if (ucum === '' || /\s/.test(ucum) || ucumName(ucum) === undefined) return undefined;
  const dimension = dimensionOf(ucum);
  if (!dimension) return undefined;
  const siUcum = SI_UCUM[dimension];
  const at0 = ucumConvert(0, ucum, siUcum);
  const at1 = ucumConvert(1, ucum, siUcum);
  if (at0 === undefined || at1 === undefined) return undefined;
  if (ucumIsSpecial(ucum)) {
    // Affine temperature scales: read the slope over a wide span so rounding of the offset does not leak in.
    const atBig = ucumConvert(1e6, ucum, siUcum);
    if (atBig === undefined) return undefined;
    return { ucum, label: labelFromUcum(ucum), dimension, siUcum, factor: (atBig - at0) / 1e6, offset: at0 };
  }
  return { ucum, label: labelFromUcum(ucum), dimension, siUcum, factor: round15(at1), offset: 0 };
}

const cache = new Map<string, UnitInfo | null>();

/** Catalogue entry for a UCUM code (case-sensitive), or undefined if it is invalid or of an unknown dimension. */
export function unitInfo(ucum: string): UnitInfo | undefined {
  let hit = cache.get(ucum);
  if (hit === undefined) {
    hit = build(ucum) ?? null;
    cache.set(ucum, hit);
  }
  return hit ?? undefined;
}

/** The UCUM codes every Ohmstead deployment must know (design notes, "Units"), plus the common extras. */
export const CATALOGUE_UCUM: readonly string[] = [
  'K', 'mK', 'Cel', '[degF]', 'T', 'mT', 'G', 'Oe', 'kOe', 'A/m',
  'Ohm', 'mOhm', 'kOhm', 'MOhm', 'Ohm.m', 'Ohm.cm', 'uOhm.cm', 'Ohm/{sq}',
  'A', 'mA', 'uA', 'nA', 'V', 'mV', 'uV', 'nV', 'Hz', 'deg', 'rad', 's', 'min', 'h',
  'cm2/(V.s)', 'm2/(V.s)', 'cm-3', 'm-3', 'cm-2', 'm-2', 'cm3/C', 'm3/C',
  'm', 'mm', 'um', 'nm', 'cm', 'S', 'W', 'uW', 'nW', '%', '1', 'V2/Hz', 'K/min', 'T/min',
];
