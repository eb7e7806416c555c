import type { Column } from '@/lib/schema';
import type { ColumnSummary } from '@/lib/transport/summary/types';

// The author's column mapping lives in the record's `columns` (matched by column name, for every file of the
// version); the parser applies it on the next analysis (lib/transport summariseFile, "overrides").

export type ColumnEntry = Column;
export type EffectiveColumn = { quantity: Column['quantity']; unit: string | null; role: Column['role']; fromRecord: boolean };

function isEntry(value: unknown): value is Partial<ColumnEntry> & { name: string } {
  return typeof value === 'object' && value !== null && typeof (value as { name?: unknown }).name === 'string';
}

/** The record's column entries (a draft may hold half-filled ones; they are kept as they are). */
export function recordColumns(record: unknown): (Partial<ColumnEntry> & { name: string })[] {
  const list = (record as { columns?: unknown } | null)?.columns;
  return Array.isArray(list) ? list.filter(isEntry) : [];
}

/** What a file column holds now: the record's entry where there is one, else what the analysis detected. */
export function effectiveColumn(column: ColumnSummary, entries: (Partial<ColumnEntry> & { name: string })[]): EffectiveColumn {
  const entry = entries.find((e) => e.name === column.name || e.name === column.rawHeader);
  return {
    quantity: entry?.quantity ?? column.quantity,
    unit: entry?.unit ?? column.ucum,
    role: entry?.role ?? column.role,
    fromRecord: Boolean(entry),
  };
}

export type ColumnChange = { quantity?: Column['quantity']; unit?: string; role?: Column['role'] };

/**
 * The record's `columns` after the author changes one column of a file: that file's columns are all written out
 * (so the record says what each holds), entries of other files are kept, and a new x column demotes the old one.
 */
export function applyColumnChange(record: unknown, fileColumns: ColumnSummary[], name: string, change: ColumnChange): unknown[] {
  const entries = recordColumns(record);
  const others = ((record as { columns?: unknown } | null)?.columns as unknown[] | undefined ?? []).filter((e) => {
    return !isEntry(e) || !fileColumns.some((c) => c.name === e.name || c.rawHeader === e.name);
  });
  const written = fileColumns.flatMap((column): Partial<ColumnEntry>[] => {
    const eff = effectiveColumn(column, entries);
    let next = { quantity: eff.quantity, unit: eff.unit, role: eff.role };
    if (column.name === name) next = { ...next, ...change };
    else if (change.role === 'x' && next.role === 'x') next = { ...next, role: 'aux' };
    // A column whose unit nobody knows yet is left out until the author picks one (the schema needs a unit).
    if (!next.unit) return [];
    return [{ name: column.name, quantity: next.quantity, unit: next.unit, role: next.role }];
  });
  return [...others, ...written];
}
