'use client';

import { formatPlain, formatQuantity, formatRange } from '@/lib/format/quantity';
import type { ColumnSummary, FileSummary } from '@/lib/transport/summary/types';
import { nodeAt, choiceLabel } from '@/components/deposit/record/schema-walk';
import { applyColumnChange, effectiveColumn, recordColumns, type ColumnChange } from './column-overrides';
import { dimensionLabel, groupedUnits, type UnitChoice } from './unit-choice';

export type ColumnMappingProps = {
  fileName: string;
  summary: FileSummary;
  record: unknown;
  catalogue: UnitChoice[];
  readOnly: boolean;
  onColumnsChange: (columns: unknown[]) => void;
};

// Vocabularies from the schema's column definition (schemas/transport-dataset.schema.json, $defs.column).
const QUANTITIES = (nodeAt(['columns', 0, 'quantity'])?.enum ?? []).map(String);
const ROLES = (nodeAt(['columns', 0, 'role'])?.enum ?? []).map(String);
const ROLE_WORDS: Record<string, string> = { x: 'x (swept)', y: 'y (measured)', aux: 'aux (kept)' };
// Parser warnings that mean the unit itself is a guess the author should confirm.
const UNIT_DOUBTS = new Set(['unit-ambiguous', 'unit-assumed', 'unit-unknown', 'unit-missing', 'unit-conflict', 'unit-symbol-font']);
const SELECT = 'w-full rounded-md border border-slate-400 bg-white px-2 py-1.5 text-sm disabled:bg-slate-100';

function confidenceTone(c: number): string {
  if (c >= 0.8) return 'bg-emerald-50 text-emerald-900 border-emerald-200';
  if (c >= 0.5) return 'bg-amber-50 text-amber-900 border-amber-200';
  return 'bg-red-50 text-red-900 border-red-200';
}

function valuesText(column: ColumnSummary): string {
  if (!column.range) return 'no numeric values';
  const unit = column.converted ? column.siUcum : column.ucum;
  if (unit && column.range.min === column.range.max) return `${formatQuantity(column.range.min, unit)} (constant)`;
  return unit ? formatRange(column.range.min, column.range.max, unit) : `${formatPlain(column.range.min)} – ${formatPlain(column.range.max)} (unit unknown)`;
}

/** Detected columns of one analysed file with the reason for each guess; the author corrects quantity, unit, role. */
export function ColumnMapping({ fileName, summary, record, catalogue, readOnly, onColumnsChange }: ColumnMappingProps) {
  const entries = recordColumns(record);
  const change = (name: string, c: ColumnChange) => onColumnsChange(applyColumnChange(record, summary.columns, name, c));
  return (
    <div className="overflow-x-auto rounded-md border border-slate-200 bg-white">
      <table className="w-full min-w-[56rem] text-sm">
        <caption className="sr-only">Columns of {fileName}: detected quantity, unit and role, with the reason for each guess</caption>
        <thead className="bg-slate-50 text-left text-xs uppercase tracking-wide text-slate-500">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">Column and why we read it so</th>
            <th scope="col" className="w-48 px-3 py-2 font-medium">Quantity</th>
            <th scope="col" className="w-44 px-3 py-2 font-medium">Unit</th>
            <th scope="col" className="w-40 px-3 py-2 font-medium">Role</th>
            <th scope="col" className="w-44 px-3 py-2 font-medium">Values (SI)</th>
          </tr>
        </thead>
        <tbody>
          {summary.columns.map((column) => {
            const eff = effectiveColumn(column, entries);
            // 'column-override' only says the record's mapping was applied; "set by you" says that already.
            const warnings = summary.warnings.filter((w) => w.column === column.name && w.code !== 'column-override');
            const doubt = !eff.fromRecord && warnings.some((w) => UNIT_DOUBTS.has(w.code));
            return (
              <tr key={column.index} className="border-t border-slate-100 align-top">
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  <span className="font-mono font-medium text-slate-900">{column.rawHeader || column.name}</span>
                  <span className={`ml-2 inline-block rounded border px-1.5 text-xs ${confidenceTone(doubt ? Math.min(column.confidence, 0.6) : column.confidence)}`}>
                    {Math.round(column.confidence * 100)} % sure{doubt ? ' · check the unit' : ''}
                  </span>
                  {eff.fromRecord && <span className="ml-2 text-xs text-copper-700">set by you</span>}
                  <p className="mt-1 text-xs text-slate-600">{column.reason}</p>
                  {warnings.map((w, i) => (
                    <p key={i} className="mt-1 text-xs text-amber-900">⚠ {w.message}</p>
                  ))}
                </th>
                <td className="px-3 py-2">
                  <select aria-label={`Quantity of column ${column.rawHeader || column.name}`} className={SELECT} disabled={readOnly}
                    value={eff.quantity} onChange={(e) => change(column.name, { quantity: e.target.value as ColumnChange['quantity'] })}>
                    {QUANTITIES.map((q) => <option key={q} value={q}>{choiceLabel(q)}</option>)}
                  </select>
                </td>
                <td className="px-3 py-2">
                  <UnitSelect column={column} unit={eff.unit} catalogue={catalogue} readOnly={readOnly} onChange={(unit) => change(column.name, { unit })} />
                </td>
                <td className="px-3 py-2">
                  <select aria-label={`Role of column ${column.rawHeader || column.name}`} className={SELECT} disabled={readOnly}
                    value={eff.role} onChange={(e) => change(column.name, { role: e.target.value as ColumnChange['role'] })}>
                    {ROLES.map((r) => <option key={r} value={r}>{ROLE_WORDS[r] ?? r}</option>)}
                  </select>
                </td>
                <td className="num px-3 py-2 text-slate-700">
                  {valuesText(column)}
                  {column.nanCount > 0 && <p className="text-xs text-slate-500">{column.nanCount} empty or non-numeric</p>}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function UnitSelect({ column, unit, catalogue, readOnly, onChange }: {
  column: ColumnSummary; unit: string | null; catalogue: UnitChoice[]; readOnly: boolean; onChange: (unit: string) => void;
}) {
  const known = catalogue.some((u) => u.ucum === unit);
  return (
    <select aria-label={`Unit of column ${column.rawHeader || column.name}`} className={SELECT} disabled={readOnly}
      value={unit ?? ''} onChange={(e) => e.target.value && onChange(e.target.value)}>
      {!unit && <option value="">unknown — choose</option>}
      {unit && !known && <option value={unit}>{unit}</option>}
      {groupedUnits(catalogue, unit).map((g) => (
        <optgroup key={g.dimension} label={dimensionLabel(g.dimension)}>
          {g.units.map((u) => <option key={u.ucum} value={u.ucum}>{`${u.label} (${u.ucum})`}</option>)}
        </optgroup>
      ))}
    </select>
  );
}
