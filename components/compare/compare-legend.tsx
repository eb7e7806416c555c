'use client';

import Link from 'next/link';
import { doiUrl, versionPath } from '@/lib/compare/legend-text';
import type { CurveStyle } from '@/lib/compare/palette';
import type { PreparedOverlay } from '@/lib/compare/prepare-overlay';
import type { CompareEntry, UnavailableEntry } from '@/lib/compare/types';

export type CompareLegendProps = {
  curves: PreparedOverlay['curves'];
  excluded: PreparedOverlay['excluded'];
  unavailable: UnavailableEntry[];
  onRemove: (entry: CompareEntry) => void;
  onRemoveUnavailable: (item: UnavailableEntry) => void;
  busyKey: string | null;
};

function Swatch({ style }: { style: CurveStyle | null }) {
  return (
    <svg aria-hidden="true" width="44" height="12" viewBox="0 0 44 12" className="mt-1 shrink-0">
      {style ? (
        <line x1="1" y1="6" x2="43" y2="6" stroke={style.colour} strokeWidth="2.5" strokeDasharray={style.dash.join(' ') || undefined} />
      ) : (
        <rect x="1" y="1" width="42" height="10" fill="none" stroke="#94a3b8" strokeDasharray="3 3" />
      )}
    </svg>
  );
}

function Source({ entry }: { entry: CompareEntry }) {
  if (!entry.source) {
    return (
      <>
        <p className="font-medium break-words text-slate-900">{entry.local?.fileName}</p>
        <p className="text-slate-600">Your own file, read in this browser only: not uploaded, not stored, no DOI.</p>
        {entry.local?.note && <p className="text-amber-900">{entry.local.note}</p>}
      </>
    );
  }
  const s = entry.source;
  return (
    <>
      <Link href={versionPath(s.datasetId, s.versionNumber)} className="inline-block min-h-6 font-medium break-words text-copper-700 underline-offset-2 hover:underline">
        {s.title}
      </Link>
      <p className="break-words text-slate-700">
        Version {s.versionNumber} ·{' '}
        {s.doi ? <a href={doiUrl(s.doi)} className="num text-copper-700 underline underline-offset-2">{doiUrl(s.doi)}</a> : 'no DOI registered'} · {s.group.name} · file {s.fileName}
      </p>
    </>
  );
}

// One button per breakpoint (beside the swatch on phones, at the row's end from 640 px); only one is ever displayed.
function RemoveButton({ className, label, busy, onClick }: { className: string; label: string; busy: boolean; onClick: () => void }) {
  return (
    <button type="button" onClick={onClick} disabled={busy} aria-label={label}
      className={`shrink-0 self-start rounded-md border border-slate-300 bg-white px-2.5 py-1 text-xs font-medium text-slate-700 hover:bg-slate-100 disabled:opacity-60 ${className}`}>
      Remove
    </button>
  );
}

/** Every curve of the basket with its source (title, version, DOI, group), style, notes, and what was left out and why. */
export function CompareLegend({ curves, excluded, unavailable, onRemove, onRemoveUnavailable, busyKey }: CompareLegendProps) {
  const rows = [
    ...curves.map((c) => ({ number: c.number, entry: c.entry, style: c.style as CurveStyle | null, notes: c.notes, reason: null as string | null, option: c.option })),
    ...excluded.map((e) => ({ number: e.number, entry: e.entry, style: null, notes: [] as string[], reason: e.reason, option: null })),
  ].sort((a, b) => a.number - b.number);
  return (
    <section aria-labelledby="compare-legend-title" className="flex flex-col gap-3">
      <h2 id="compare-legend-title" className="text-base font-semibold text-slate-900">Curves and sources</h2>
      <ol className="flex flex-col divide-y divide-slate-200 rounded-md border border-slate-200 bg-white">
        {rows.map((r) => (
          <li key={r.entry.key} className="flex flex-col gap-1.5 px-3 py-2.5 text-sm sm:flex-row sm:gap-3">
            <div className="flex items-start gap-2 sm:gap-3">
              <span className="num w-5 shrink-0 pt-0.5 text-right font-semibold text-slate-700">{r.number}.</span>
              <Swatch style={r.style} />
              <RemoveButton className="ml-auto sm:hidden" label={`Remove curve ${r.number} from the comparison`} busy={busyKey === r.entry.key} onClick={() => onRemove(r.entry)} />
            </div>
            <div className="min-w-0 flex-1">
              <Source entry={r.entry} />
              {r.style && r.option && (
                <p className="text-slate-600">
                  {r.option.y.column}{r.option.derived ? ' (computed by Ohmstead)' : ''} against {r.option.x.column} · {r.style.dashName} line
                </p>
              )}
              {r.reason && <p className="text-amber-900">{r.reason}</p>}
              {r.notes.map((n) => <p key={n} className="text-xs text-slate-600">{n}</p>)}
            </div>
            <RemoveButton className="hidden sm:block" label={`Remove curve ${r.number} from the comparison`} busy={busyKey === r.entry.key} onClick={() => onRemove(r.entry)} />
          </li>
        ))}
        {unavailable.map((u) => (
          <li key={u.key} className="flex flex-col gap-1.5 px-3 py-2.5 text-sm sm:flex-row sm:gap-3">
            <div className="flex items-start gap-2 sm:gap-3">
              <span className="w-5 shrink-0" />
              <Swatch style={null} />
              <RemoveButton className="ml-auto sm:hidden" label="Remove this unavailable curve from the basket" busy={busyKey === u.key} onClick={() => onRemoveUnavailable(u)} />
            </div>
            <div className="min-w-0 flex-1">
              <p className="font-medium text-slate-800">A curve that can no longer be shown</p>
              <p className="text-amber-900">{u.message}</p>
            </div>
            <RemoveButton className="hidden sm:block" label="Remove this unavailable curve from the basket" busy={busyKey === u.key} onClick={() => onRemoveUnavailable(u)} />
          </li>
        ))}
      </ol>
    </section>
  );
}
