import type { ColumnSummary } from '@/lib/transport/summary/types';

/** One measured variable with its unit (UCUM) and the range seen across the dataset's files. */
export type MeasuredVariable = {
  /** Column name as in the file, e.g. "T". */
  name: string;
  /** Ohmstead quantity, e.g. "temperature". */
  quantity: string;
  ucum: string | null;
  min?: number;
  max?: number;
};

type SummaryColumns = { columns: Pick<ColumnSummary, 'name' | 'quantity' | 'ucum' | 'siUcum' | 'converted' | 'range'>[] };

/** Merges the columns of several file summaries by quantity and unit, widening the range (ranges are in siUcum when converted). */
export function variablesFromSummaries(summaries: SummaryColumns[]): MeasuredVariable[] {
  const merged = new Map<string, MeasuredVariable>();
  for (const summary of summaries) {
    for (const column of summary.columns) {
      const ucum = column.converted ? column.siUcum : column.ucum;
      const key = `${column.quantity}|${ucum ?? ''}|${column.quantity === 'other' ? column.name : ''}`;
      const current = merged.get(key) ?? { name: column.name, quantity: column.quantity, ucum };
      if (column.range) {
        current.min = current.min === undefined ? column.range.min : Math.min(current.min, column.range.min);
        current.max = current.max === undefined ? column.range.max : Math.max(current.max, column.range.max);
      }
      merged.set(key, current);
    }
  }
  return [...merged.values()];
}
