'use client';

import { useState } from 'react';
import { buildCompareCsv } from '@/lib/compare/build-csv';
import type { OverlaySettings, PreparedOverlay } from '@/lib/compare/prepare-overlay';
import { renderOverlaySvg } from '@/lib/compare/render-svg';
import type { CompareEntry } from '@/lib/compare/types';
import type { ParsedTable } from '@/lib/transport/parse';
import { exportBaseName, saveBlob, svgToPng } from './download';
import { loadFullCurves } from './full-curves';

export type ExportActionsProps = {
  overlay: PreparedOverlay;
  entries: readonly CompareEntry[];
  tables: ReadonlyMap<string, ParsedTable>;
  settings: OverlaySettings;
};

type Status = { kind: 'idle' } | { kind: 'busy'; text: string } | { kind: 'done'; text: string; problems: string[] } | { kind: 'error'; text: string };

const BUTTON = 'rounded-md border border-slate-300 bg-white px-3 py-1.5 text-sm font-semibold text-slate-800 hover:bg-slate-100 disabled:cursor-wait disabled:opacity-60';

/** PNG and SVG of what is drawn, and the CSV of the full-resolution data with a header citing every source. */
export function ExportActions({ overlay, entries, tables, settings }: ExportActionsProps) {
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const busy = status.kind === 'busy';
  const nothing = overlay.curves.length === 0;
  const svg = () => renderOverlaySvg(overlay, {
    logX: settings.logX, logY: settings.logY,
    footer: `Ohmstead compare · exported ${new Date().toISOString()} · ${window.location.origin} · cite each source by its DOI`,
  });

  async function run(label: string, work: () => Promise<string>) {
    setStatus({ kind: 'busy', text: `${label}…` });
    try {
      setStatus({ kind: 'done', text: await work(), problems: [] });
    } catch (error) {
      setStatus({ kind: 'error', text: `${label} failed: ${error instanceof Error ? error.message : String(error)}` });
    }
  }

  const exportSvg = () => run('Preparing the SVG', async () => {
    saveBlob(new Blob([svg()], { type: 'image/svg+xml' }), `${exportBaseName()}.svg`);
    return 'SVG saved.';
  });
  const exportPng = () => run('Preparing the PNG', async () => {
    saveBlob(await svgToPng(svg()), `${exportBaseName()}.png`);
    return 'PNG saved.';
  });
  async function exportCsv() {
    setStatus({ kind: 'busy', text: 'Reading the full-resolution curves…' });
    try {
      const { full, problems } = await loadFullCurves(entries, tables, settings, (done, total) =>
        setStatus({ kind: 'busy', text: `Reading the full-resolution curves: ${done} of ${total}…` }));
      const csv = buildCompareCsv({ entries, settings, full, exportedAt: new Date().toISOString(), siteUrl: window.location.origin });
      saveBlob(new Blob([csv], { type: 'text/csv;charset=utf-8' }), `${exportBaseName()}.csv`);
      setStatus({ kind: 'done', text: `CSV saved (${full.size} curve${full.size === 1 ? '' : 's'} at full resolution).`, problems });
    } catch (error) {
      setStatus({ kind: 'error', text: `The CSV could not be made: ${error instanceof Error ? error.message : String(error)}` });
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm font-medium text-slate-800">Export</span>
        <button type="button" className={BUTTON} disabled={busy || nothing} onClick={exportPng}>PNG</button>
        <button type="button" className={BUTTON} disabled={busy || nothing} onClick={exportSvg}>SVG</button>
        <button type="button" className={BUTTON} disabled={busy || nothing} onClick={exportCsv}>CSV (full resolution)</button>
      </div>
      <div role="status" aria-live="polite" className="text-sm">
        {status.kind === 'busy' && <p className="text-slate-700">{status.text}</p>}
        {status.kind === 'done' && (
          <>
            <p className="text-emerald-800">{status.text}</p>
            {status.problems.map((p) => <p key={p} className="text-amber-900">{p} — left out of the CSV.</p>)}
          </>
        )}
        {status.kind === 'error' && <p className="text-red-800">{status.text}</p>}
      </div>
    </div>
  );
}
