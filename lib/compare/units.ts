// Display units for the compare view. Curves arrive in SI (lib/transport converts every recognised column); here
// they are shown in SI or in the practitioner's units. A static table keeps the UCUM engine out of the browser
// bundle; tests/unit/compare check every factor against lib/transport/units.

export type UnitSystem = 'practitioner' | 'si';

/** One display unit: shown value = SI value / factor. */
export type DisplayUnit = { ucum: string; label: string; factor: number; convention?: string };

/** Field strength is not flux density: Oe ↔ T is the lab convention B = μ0·H in vacuum (lib/transport/units/field.ts). */
export const OERSTED_CONVENTION_NOTE = 'Oe and T are related by the lab convention 1 Oe ↔ 1e-4 T (B = μ0·H in vacuum, μ0 = 4π×10⁻⁷ T·m/A).';

const OE = OERSTED_CONVENTION_NOTE;

// The SI unit first; then the units practitioners use for the same quantity.
const TABLE: Readonly<Record<string, readonly DisplayUnit[]>> = {
  K: [{ ucum: 'K', label: 'K', factor: 1 }, { ucum: 'mK', label: 'mK', factor: 1e-3 }],
  T: [
    { ucum: 'T', label: 'T', factor: 1 },
    { ucum: 'mT', label: 'mT', factor: 1e-3 },
    { ucum: 'Oe', label: 'Oe', factor: 1e-4, convention: OE },
    { ucum: 'kOe', label: 'kOe', factor: 1e-1, convention: OE },
  ],
  Ohm: [
    { ucum: 'Ohm', label: 'Ω', factor: 1 },
    { ucum: 'mOhm', label: 'mΩ', factor: 1e-3 },
    { ucum: 'kOhm', label: 'kΩ', factor: 1e3 },
    { ucum: 'MOhm', label: 'MΩ', factor: 1e6 },
  ],
  'Ohm.m': [
    { ucum: 'Ohm.m', label: 'Ω·m', factor: 1 },
    { ucum: 'Ohm.cm', label: 'Ω·cm', factor: 1e-2 },
    { ucum: 'mOhm.cm', label: 'mΩ·cm', factor: 1e-5 },
    { ucum: 'uOhm.cm', label: 'µΩ·cm', factor: 1e-8 },
  ],
  'Ohm/{sq}': [{ ucum: 'Ohm/{sq}', label: 'Ω/sq', factor: 1 }, { ucum: 'kOhm/{sq}', label: 'kΩ/sq', factor: 1e3 }],
  '%': [{ ucum: '%', label: '%', factor: 1 }],
  V: [{ ucum: 'V', label: 'V', factor: 1 }, { ucum: 'mV', label: 'mV', factor: 1e-3 }, { ucum: 'uV', label: 'µV', factor: 1e-6 }, { ucum: 'nV', label: 'nV', factor: 1e-9 }],
  A: [{ ucum: 'A', label: 'A', factor: 1 }, { ucum: 'mA', label: 'mA', factor: 1e-3 }, { ucum: 'uA', label: 'µA', factor: 1e-6 }, { ucum: 'nA', label: 'nA', factor: 1e-9 }],
  S: [{ ucum: 'S', label: 'S', factor: 1 }, { ucum: 'mS', label: 'mS', factor: 1e-3 }],
  'S/m': [{ ucum: 'S/m', label: 'S/m', factor: 1 }, { ucum: 'S/cm', label: 'S/cm', factor: 100 }],
  Hz: [{ ucum: 'Hz', label: 'Hz', factor: 1 }, { ucum: 'kHz', label: 'kHz', factor: 1e3 }],
  s: [{ ucum: 's', label: 's', factor: 1 }, { ucum: 'min', label: 'min', factor: 60 }, { ucum: 'h', label: 'h', factor: 3600 }],
  rad: [{ ucum: 'rad', label: 'rad', factor: 1 }, { ucum: 'deg', label: '°', factor: Math.PI / 180 }],
};

/** The SI unit codes the table covers (tests walk them). */
export const DISPLAY_UNIT_TABLE = TABLE;

/** Units an axis whose values are in `siUcum` can be shown in; SI first. Unknown units only show as they are. */
export function unitOptions(siUcum: string | null): readonly DisplayUnit[] {
  if (siUcum === null) return [{ ucum: '?', label: 'unit unknown', factor: 1 }];
  return TABLE[siUcum] ?? [{ ucum: siUcum, label: siUcum === '1' ? '1' : siUcum, factor: 1 }];
}

/**
 * The unit a practitioner would pick for values up to `maxAbs` (SI): resistivity in µΩ·cm for metals and Ω·cm
 * above 100 µΩ·cm (common practice, as lib/format/quantity), field in T, otherwise the prefix that leaves 1–999.
 */
export function preferredUnit(siUcum: string | null, maxAbs: number, system: UnitSystem = 'practitioner'): DisplayUnit {
  const options = unitOptions(siUcum);
  if (system === 'si' || !Number.isFinite(maxAbs) || maxAbs <= 0) return options[0];
  if (siUcum === 'Ohm.m') return options.find((u) => u.ucum === (maxAbs < 1e-4 ? 'uOhm.cm' : 'Ohm.cm')) ?? options[0];
  if (siUcum === 'T') return options[0];
  // 0.9995 keeps 999.96 from printing as 1000 of the smaller unit after rounding (as displayScale does).
  const fitting = options.filter((u) => !u.convention && u.factor <= maxAbs / 0.9995);
  return fitting.length ? fitting.reduce((a, b) => (b.factor > a.factor ? b : a)) : options.reduce((a, b) => (b.factor < a.factor ? b : a));
}

export function findUnit(siUcum: string | null, ucum: string): DisplayUnit | undefined {
  return unitOptions(siUcum).find((u) => u.ucum === ucum);
}
