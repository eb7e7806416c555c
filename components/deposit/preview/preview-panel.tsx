'use client';

import dynamic from 'next/dynamic';
import { useState } from 'react';
import type { UnitChoice } from '@/components/deposit/columns/unit-choice';
import type { SummarySource } from '@/components/deposit/workspace/summary-sources';
import { previewView } from './preview-view';

// uPlot draws on a canvas: the plot is loaded in the browser only.
const CurvePlot = dynamic(() => import('@/components/plot/curve-plot').then((m) => m.CurvePlot), {
  ssr: false,
  loading: () => <div className="flex h-[360px] items-center justify-center rounded-md bg-slate-50 text-sm text-slate-500">Loading the plot…</div>,
});

export type PreviewPanelProps = { sources: SummarySource[]; record: unknown; catalogue: UnitChoice[] };

const SELECT = 'rounded-md border border-slate-400 bg-white px-2 py-1.5 text-sm';

/** The curves of the files, redrawn as the author maps columns; log axes on request. */
export function PreviewPanel({ sources, record, catalogue }: PreviewPanelProps) {
  const [sourceKey, setSourceKey] = useState<string | null>(null);
  const [curveIndex, setCurveIndex] = useState(0);
  const [logX, setLogX] = useState(false);
  const [logY, setLogY] = useState(false);
  const withCurves = sources.filter((s) => s.summary.previews.length > 0);
  const source = withCurves.find((s) => s.key === sourceKey) ?? withCurves[0];
  const preview = source?.summary.previews[Math.min(curveIndex, source.summary.previews.length - 1)];
  const view = source && preview ? previewView(preview, source.summary, record, catalogue) : null;

  if (!source || !preview || !view) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-sm text-slate-600">
        No curve to show yet. Add a data file above (the first rows preview at once), or check the column roles: a plot needs one
        column with role x and at least one with role y.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        {withCurves.length > 1 && (
          <label className="flex flex-col gap-1 text-sm font-medium text-slate-800">
            File
            <select className={SELECT} value={source.key} onChange={(e) => { setSourceKey(e.target.value); setCurveIndex(0); }}>
              {withCurves.map((s) => <option key={s.key} value={s.key}>{s.label}</option>)}
            </select>
          </label>
        )}
        <label className="flex flex-col gap-1 text-sm font-medium text-slate-800">
          Curve
          <select className={SELECT} value={String(curveIndex)} onChange={(e) => setCurveIndex(Number(e.target.value))}>
            {source.summary.previews.map((p, i) => (
              <option key={`${p.x}-${p.y}-${i}`} value={String(i)}>{`${p.y} against ${p.x}${p.derived ? ' (computed)' : ''}`}</option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" checked={logX} onChange={(e) => setLogX(e.target.checked)} className="h-4 w-4 accent-copper-600" />
          Log x axis
        </label>
        <label className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" checked={logY} onChange={(e) => setLogY(e.target.checked)} className="h-4 w-4 accent-copper-600" />
          Log y axis
        </label>
      </div>
      {source.note && <p className="text-xs text-slate-600">{source.note}</p>}
      {view.stale && (
        <p role="status" className="rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-950">
          Your mapping changed this curve; it is redrawn when the file has been analysed again.
        </p>
      )}
      <CurvePlot points={view.points} xName={view.xName} yName={view.yName} xUnit={view.xUnit} yUnit={view.yUnit}
        logX={logX} logY={logY} sourcePoints={preview.sourcePoints} />
    </div>
  );
}
