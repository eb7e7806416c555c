'use client';

import { ColumnMapping } from '@/components/deposit/columns/column-mapping';
import type { UnitChoice } from '@/components/deposit/columns/unit-choice';
import type { FileView } from '@/lib/client/uploads/types';
import type { FileAnalysis } from './use-file-analyses';
import type { LocalPreviewEntry, SummarySource } from './summary-sources';

export type ColumnsSectionProps = {
  files: FileView[];
  analyses: Record<string, FileAnalysis>;
  sources: SummarySource[];
  localErrors: LocalPreviewEntry[];
  record: unknown;
  catalogue: UnitChoice[];
  readOnly: boolean;
  onColumnsChange: (columns: unknown[]) => void;
};

function progressText(a: FileAnalysis | undefined, f: FileView): string {
  const state = a?.state ?? f.analysisState;
  const progress = a?.progress ?? f.analysisProgress;
  if (state === 'queued') return 'waiting to be analysed…';
  if (state === 'running') return `being analysed… ${Math.round(progress * 100)} %`;
  return 'loading the analysis…';
}

/** Per file: the detected columns to correct, or where its analysis stands. */
export function ColumnsSection({ files, analyses, sources, localErrors, record, catalogue, readOnly, onColumnsChange }: ColumnsSectionProps) {
  const verified = files.filter((f) => f.uploadState === 'verified');
  const waiting = verified.filter((f) => f.analysisState !== 'none' && !analyses[f.id]?.summary && !analyses[f.id]?.error && !analyses[f.id]?.loadError);
  const failed = verified.filter((f) => (analyses[f.id]?.state ?? f.analysisState) === 'failed' && (analyses[f.id]?.error || analyses[f.id]?.loadError));
  const notTables = verified.filter((f) => f.analysisState === 'none');
  const unreadable = localErrors.filter((p) => p.error && !verified.some((f) => f.name === p.name));
  if (sources.length === 0 && waiting.length === 0 && failed.length === 0 && unreadable.length === 0) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-sm text-slate-600">
        {notTables.length > 0 ? 'None of the files is a table we can read. ' : ''}Add a CSV, TSV or text export above: its columns appear here as soon as
        you pick it (read in your browser), and again once the server has analysed the whole file.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      {sources.map((s) => (
        <div key={s.key} className="flex flex-col gap-2">
          <h3 className="font-mono text-sm font-semibold text-slate-900">{s.label}</h3>
          {s.note && <p className="text-xs text-slate-600">{s.note}</p>}
          <ColumnMapping fileName={s.label} summary={s.summary} record={record} catalogue={catalogue} readOnly={readOnly} onColumnsChange={onColumnsChange} />
          {s.summary.warnings.filter((w) => !w.column).map((w, i) => (
            <p key={i} className="text-xs text-amber-900">⚠ {w.line > 0 ? `Line ${w.line}: ` : ''}{w.message}</p>
          ))}
        </div>
      ))}
      {waiting.map((f) => (
        <p key={f.id} role="status" className="rounded-md border border-slate-200 bg-white px-4 py-3 text-sm text-slate-700">
          <span className="font-mono">{f.name}</span>: {progressText(analyses[f.id], f)}
        </p>
      ))}
      {failed.map((f) => (
        <div key={f.id} role="alert" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-sm text-red-950">
          <p><span className="font-mono font-semibold">{f.name}</span> could not be analysed: {analyses[f.id]?.error ?? analyses[f.id]?.loadError}</p>
          <p className="mt-1 text-xs">The file is kept. Export it as CSV, TSV or plain text and add that too, or mark this one as “other”.</p>
        </div>
      ))}
      {unreadable.map((p) => (
        <p key={p.name} role="status" className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-sm text-amber-950">
          <span className="font-mono font-semibold">{p.name}</span> has no instant preview: {p.error}
        </p>
      ))}
    </div>
  );
}
