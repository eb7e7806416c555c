import { formatQuantity, formatRange, SI_PREFIXES } from '@/lib/format/quantity';
import type { FileSummary } from '@/lib/transport/summary/types';
import { getAt, setAt, type RecordPath } from './record-paths';
import { choiceLabel, nodeAt, unitChoices } from './schema-walk';

/** One value the files already tell, for an empty field of the record. */
export type Suggestion = { path: RecordPath; value: unknown; field: string; text: string; from: string };

const enumOf = (path: RecordPath) => (nodeAt(path)?.enum ?? []).map(String);
const sig4 = (x: number) => Number(x.toPrecision(4));

/** The unit of `units` (prefixed forms of one base, e.g. A, mA, µA) that shows `valueSi` as 1 or more. */
function bestPrefixed(valueSi: number, units: string[], base: string): { value: number; unit: string } | undefined {
  const scaled = units.flatMap((unit) => {
    const prefix = SI_PREFIXES.find((p) => p.ucum + base === unit);
    return prefix ? [{ unit, value: valueSi / prefix.scale }] : [];
  });
  return scaled.filter((s) => s.value >= 1).sort((a, b) => a.value - b.value)[0] ?? scaled.sort((a, b) => b.value - a.value)[0];
}

function headerValue(summary: FileSummary, pattern: RegExp): string | undefined {
  const entry = Object.entries(summary.headerMetadata).find(([k]) => pattern.test(k.trim()));
  const value = entry?.[1].trim();
  return value ? value.slice(0, 200) : undefined;
}

/** What the analysed files say that the record does not yet: ranges, sweep, quantity, excitation, sample name. */
export function suggestionsFrom(record: unknown, sources: { label: string; summary: FileSummary }[]): Suggestion[] {
  const out: Suggestion[] = [];
  const offer = (path: RecordPath, value: unknown, text: string, from: string) => {
    if (getAt(record, path) !== undefined || out.some((s) => s.path.join('.') === path.join('.'))) return;
    out.push({ path, value, text, from, field: nodeAt(path)?.title ?? path.join('.') });
  };
  for (const { label, summary } of sources) {
    const col = (q: string) => summary.columns.find((c) => c.quantity === q && c.converted && c.range);
    const t = col('temperature');
    if (t?.range && t.siUcum === 'K') {
      offer(['environment', 'temperatureRange'], { min: sig4(t.range.min), max: sig4(t.range.max), unit: 'K' }, formatRange(t.range.min, t.range.max, 'K'), label);
    }
    const b = col('field');
    if (b?.range && b.siUcum === 'T') {
      offer(['environment', 'fieldRange'], { min: sig4(b.range.min), max: sig4(b.range.max), unit: 'T' }, `${sig4(b.range.min)} to ${sig4(b.range.max)} T`, label);
    }
    const sweep = summary.sweep.variable;
    if (sweep && enumOf(['environment', 'sweepVariable']).includes(sweep)) offer(['environment', 'sweepVariable'], sweep, choiceLabel(sweep), label);
    const y = summary.columns.find((c) => c.role === 'y');
    if (y && enumOf(['measurement', 'quantity']).includes(y.quantity)) offer(['measurement', 'quantity'], y.quantity, choiceLabel(y.quantity), label);
    const i = col('current');
    // A current column holding one value (within 1 %) is the excitation, as lib/transport's summary also reads it.
    if (i?.range && i.range.max > 0 && i.range.max - i.range.min <= 0.01 * i.range.max) {
      const path = ['measurement', 'excitation', 'currentAmplitude'];
      const pick = bestPrefixed((i.range.max + i.range.min) / 2, unitChoices(nodeAt(path) ?? {}), 'A');
      if (pick) offer(path, { value: sig4(pick.value), unit: pick.unit }, formatQuantity((i.range.max + i.range.min) / 2, 'A'), label);
    }
    const name = headerValue(summary, /^sample( name| id)?$/i);
    if (name) offer(['sample', 'name'], name, name, label);
    const material = headerValue(summary, /^material$/i);
    if (material) offer(['sample', 'material'], material, material, label);
  }
  return out;
}

/** The record with every suggestion filled in (fields the author has set in the meantime are left alone). */
export function applySuggestions(record: unknown, suggestions: Suggestion[]): unknown {
  return suggestions.reduce((r, s) => (getAt(r, s.path) === undefined ? setAt(r, s.path, s.value) : r), record);
}
