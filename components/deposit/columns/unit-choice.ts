import type { Dimension } from '@/lib/transport/units/dimensions';

/** One unit of the catalogue as the browser gets it: SI value = value · factor + offset. */
export type UnitChoice = { ucum: string; label: string; dimension: Dimension; siUcum: string; factor: number; offset: number };

/** 'magneticFluxDensity' → 'magnetic flux density'. */
export function dimensionLabel(dimension: string): string {
  return dimension.replace(/([A-Z])/g, ' $1').toLowerCase();
}

/** Units grouped by dimension for a select, the group of `current` first so the likely fix is at the top. */
export function groupedUnits(catalogue: UnitChoice[], current: string | null): { dimension: string; units: UnitChoice[] }[] {
  const groups = new Map<string, UnitChoice[]>();
  for (const u of catalogue) groups.set(u.dimension, [...(groups.get(u.dimension) ?? []), u]);
  const first = catalogue.find((u) => u.ucum === current)?.dimension;
  const ordered = [...groups.entries()].sort(([a], [b]) => (a === first ? -1 : b === first ? 1 : 0));
  return ordered.map(([dimension, units]) => ({ dimension, units }));
}

/** Converts a value between two catalogue units of one dimension; undefined when either is unknown or they differ. */
export function convertWith(catalogue: UnitChoice[], value: number, from: string, to: string): number | undefined {
  const a = catalogue.find((u) => u.ucum === from);
  const b = catalogue.find((u) => u.ucum === to);
  if (!a || !b || a.dimension !== b.dimension) return undefined;
  return (value * a.factor + a.offset - b.offset) / b.factor;
}
