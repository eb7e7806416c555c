import { formatNumber, formatQuantity, formatQuantityParts } from '@/lib/format/quantity';
import type { LandingDerivedFile } from '@/lib/datasets/landing-types';
import type { QualityFlag, QualitySeverity } from '@/lib/transport/quality/types';
import type { DerivedValue } from '@/lib/transport/summary/types';

const SEVERITY: Record<QualitySeverity, { word: string; tone: string; mark: string }> = {
  serious: { word: 'Serious', tone: 'border-red-300 bg-red-50 text-red-950', mark: '◆' },
  warning: { word: 'Warning', tone: 'border-amber-300 bg-amber-50 text-amber-950', mark: '▲' },
  info: { word: 'Note', tone: 'border-slate-300 bg-white text-slate-800', mark: '●' },
};
const ORDER: QualitySeverity[] = ['serious', 'warning', 'info'];

/** { 'temperature[K]': 300 } → 'temperature 300 K'. */
function atText(at: Record<string, number> | undefined): string {
  if (!at) return '';
  return Object.entries(at)
    .map(([key, value]) => {
      const m = /^(.+)\[(.+)\]$/.exec(key);
      return m ? `${m[1]} ${formatQuantity(value, m[2])}` : `${key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()} ${formatNumber(value)}`;
    })
    .join(', ');
}

function DerivedRow({ value }: { value: DerivedValue }) {
  const parts = formatQuantityParts(value.value, value.ucum);
  return (
    <tr className="border-t border-slate-100 align-top">
      <th scope="row" className="px-3 py-2 text-left font-medium text-slate-800">
        {value.label}
        {value.at && <span className="block text-xs font-normal text-slate-600">at {atText(value.at)}</span>}
        <span className="mt-1 block text-xs font-normal text-slate-600 sm:hidden">{value.method}</span>
      </th>
      <td className="num px-3 py-2 text-right whitespace-nowrap">
        <span className="font-semibold text-slate-900">{parts.text}</span>
        {parts.alternative && <span className="block text-xs text-slate-600">= {parts.alternative}</span>}
      </td>
      <td className="min-w-[12rem] px-3 py-2 text-xs text-slate-600 max-sm:hidden">{value.method}</td>
    </tr>
  );
}

function Flags({ flags }: { flags: QualityFlag[] }) {
  if (flags.length === 0) return <p className="text-sm text-slate-600">No quality flags: the checks we run found nothing questionable.</p>;
  const sorted = [...flags].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity));
  return (
    <ul className="flex flex-col gap-2">
      {sorted.map((flag, i) => {
        const s = SEVERITY[flag.severity];
        return (
          <li key={`${flag.code}-${i}`} className={`rounded-md border px-3 py-2 text-sm ${s.tone}`}>
            <p><span aria-hidden="true" className="mr-1">{s.mark}</span><span className="font-semibold">{s.word}:</span> {flag.message}</p>
            <p className="mt-1 text-xs">Source: {flag.source} · Rule: {flag.rule}</p>
            {flag.safety && (
              <p className="mt-2 rounded border border-amber-400 bg-amber-100 px-2 py-1 text-amber-950">
                <span className="font-semibold">Lab safety:</span> {flag.safety} Local rules and the instrument&apos;s documentation take precedence over this note.
              </p>
            )}
          </li>
        );
      })}
    </ul>
  );
}

function DerivedBody({ file }: { file: LandingDerivedFile }) {
  return (
    <>
      {file.derived.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="sr-only">Quantities computed from {file.fileName}</caption>
            <thead className="text-left text-xs tracking-wide text-slate-600 uppercase">
              <tr><th scope="col" className="px-3 py-1 font-medium">Quantity</th><th scope="col" className="px-3 py-1 text-right font-medium">Value</th><th scope="col" className="px-3 py-1 font-medium max-sm:hidden">How</th></tr>
            </thead>
            <tbody>{file.derived.map((d) => <DerivedRow key={d.key} value={d} />)}</tbody>
          </table>
        </div>
      ) : (
        <p className="text-sm text-slate-600">Nothing could be computed from this file.</p>
      )}
      {file.notComputed.length > 0 && (
        <div>
          <p className="text-sm font-semibold text-slate-800">Not computed</p>
          <ul className="mt-1 list-disc pl-5 text-sm text-slate-700">{file.notComputed.map((n) => <li key={n.key}>{n.reason}</li>)}</ul>
        </div>
      )}
      <div>
        <p className="mb-1 text-sm font-semibold text-slate-800">Quality flags</p>
        <Flags flags={file.quality} />
      </div>
    </>
  );
}

/** '12 values · 1 warning' for a collapsed file. */
function tally(file: LandingDerivedFile): string {
  const parts = [`${file.derived.length} ${file.derived.length === 1 ? 'value' : 'values'}`];
  for (const severity of ORDER) {
    const n = file.quality.filter((q) => q.severity === severity).length;
    if (n > 0) parts.push(`${n} ${SEVERITY[severity].word.toLowerCase()}${n === 1 ? '' : 's'}`);
  }
  return parts.join(' · ');
}

const BOX = 'flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-4';

export type DerivedSectionProps = { files: LandingDerivedFile[] };

/**
 * Per analysed file: computed quantities with units and method, what was not computed and why, and the flags.
 * With more than two files each one folds away (the first stays open), so the page stays readable.
 */
export function DerivedSection({ files }: DerivedSectionProps) {
  if (files.length <= 2) {
    return (
      <div className="flex flex-col gap-4">
        {files.map((f) => (
          <section key={f.fileId} aria-label={`Derived quantities of ${f.fileName}`} className={BOX}>
            <h3 className="font-semibold break-all text-slate-900">{f.fileName}</h3>
            <DerivedBody file={f} />
          </section>
        ))}
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      {files.map((f, i) => (
        <details key={f.fileId} open={i === 0} className={`group ${BOX}`}>
          <summary className="flex cursor-pointer flex-wrap items-baseline justify-between gap-2">
            <h3 className="inline font-semibold break-all text-slate-900">{f.fileName}</h3>
            <span className="text-xs text-slate-600">{tally(f)}</span>
          </summary>
          <DerivedBody file={f} />
        </details>
      ))}
    </div>
  );
}
