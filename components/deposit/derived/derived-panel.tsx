import { formatQuantityParts } from '@/lib/format/quantity';
import type { DerivedValue, FileSummary } from '@/lib/transport/summary/types';
import { formatAt } from './format-at';
import { QualityFlags } from './quality-flags';

function DerivedRow({ value }: { value: DerivedValue }) {
  const parts = formatQuantityParts(value.value, value.ucum);
  return (
    <tr className="border-t border-slate-100 align-top">
      <th scope="row" className="px-3 py-2 text-left font-medium text-slate-800">
        {value.label}
        {value.at && <span className="block text-xs font-normal text-slate-500">at {formatAt(value.at)}</span>}
      </th>
      <td className="num whitespace-nowrap px-3 py-2 text-right">
        <span className="font-semibold text-slate-900">{parts.text}</span>
        {parts.alternative && <span className="block text-xs text-slate-600">= {parts.alternative}</span>}
      </td>
      <td className="px-3 py-2 text-xs text-slate-600">{value.method}</td>
    </tr>
  );
}

export type DerivedPanelProps = { fileLabel: string; summary: FileSummary; note?: string };

/** Computed quantities with units and how each was obtained, what could not be computed and why, and the flags. */
export function DerivedPanel({ fileLabel, summary, note }: DerivedPanelProps) {
  return (
    <section aria-label={`Derived quantities and flags of ${fileLabel}`} className="flex flex-col gap-3 rounded-md border border-slate-200 bg-white p-4">
      <h3 className="font-semibold text-slate-900">{fileLabel}</h3>
      {note && <p className="text-xs text-slate-600">{note}</p>}
      {summary.derived.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="sr-only">Quantities computed from {fileLabel}</caption>
            <thead className="text-left text-xs uppercase tracking-wide text-slate-500">
              <tr><th scope="col" className="px-3 py-1 font-medium">Quantity</th><th scope="col" className="px-3 py-1 text-right font-medium">Value</th><th scope="col" className="px-3 py-1 font-medium">How</th></tr>
            </thead>
            <tbody>{summary.derived.map((d) => <DerivedRow key={d.key} value={d} />)}</tbody>
          </table>
        </div>
      ) : (
        <p className="text-sm text-slate-600">Nothing computed from this file yet.</p>
      )}
      {summary.notComputed.length > 0 && (
        <div>
          <h4 className="text-sm font-semibold text-slate-800">Not computed</h4>
          <ul className="mt-1 list-disc pl-5 text-sm text-slate-700">
            {summary.notComputed.map((n) => <li key={n.key}>{n.reason}</li>)}
          </ul>
        </div>
      )}
      <div>
        <h4 className="mb-1 text-sm font-semibold text-slate-800">Quality flags</h4>
        <QualityFlags flags={summary.quality} />
      </div>
      <p className="text-xs text-slate-500">
        {summary.rowCount} rows read{summary.truncated ? ' (preview limit)' : ''} · {summary.encoding} · delimiter{' '}
        {summary.delimiter === '\t' ? 'tab' : summary.delimiter === 'whitespace' ? 'spaces' : `“${summary.delimiter}”`} · decimal “{summary.decimalSeparator}”
      </p>
    </section>
  );
}
