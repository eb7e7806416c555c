'use client';

import dynamic from 'next/dynamic';
import { useId, useState } from 'react';
import { AddToCompareButton } from '@/components/compare/add-to-compare-button';
import { displayScale } from '@/lib/format/quantity';
import type { LandingCurves, UnitOption } from '@/lib/datasets/landing-types';
import type { CurvePreview } from '@/lib/transport/summary/types';

// uPlot draws on a canvas: the plot loads in the browser only.
const CurvePlot = dynamic(() => import('@/components/plot/curve-plot').then((m) => m.CurvePlot), {
  ssr: false,
  loading: () => <div className="flex h-[360px] items-center justify-center rounded-md bg-slate-50 text-sm text-slate-600">Loading the plot…</div>,
});

export type CurvesPanelProps = {
  curves: LandingCurves;
  /** Set on published versions: offers the shown curve to the compare basket. */
  compareVersionId?: string;
};

const AUTO = 'auto';
const SELECT = 'w-full rounded-md border border-slate-400 bg-white px-2 py-1.5 text-sm sm:w-auto';
// Symbols the trade uses for the curves lib/transport computes from the measured ones.
const DERIVED_SYMBOL: Readonly<Record<string, string>> = { resistivity: 'ρ', 'sheet-resistance': 'R□', magnetoresistance: 'MR' };

const curveName = (p: CurvePreview, axis: 'x' | 'y') => (axis === 'y' && p.derived ? (DERIVED_SYMBOL[p.y] ?? p.y) : p[axis]);

type Scale = { toDisplay: (si: number) => number; label: string };

/** How an axis in `siUcum` is shown: 'auto' picks the SI prefix that suits the values; else the chosen unit. */
function scaleFor(siUcum: string | null, choice: string, options: UnitOption[], maxAbs: number): Scale {
  if (!siUcum) return { toDisplay: (v) => v, label: 'unit unknown' };
  const picked = options.find((u) => u.ucum === choice);
  if (choice !== AUTO && picked) return { toDisplay: (v) => (v - picked.offset) / picked.factor, label: picked.label };
  const auto = displayScale(siUcum, maxAbs);
  return { toDisplay: (v) => v * auto.factor, label: auto.label };
}

/** The preview's points in the chosen display units, with the axis unit labels. */
function displayed(p: CurvePreview, xChoice: string, yChoice: string, units: LandingCurves['units']) {
  const maxAbs = (k: 0 | 1) => p.points.reduce((m, pt) => (Number.isFinite(pt[k]) ? Math.max(m, Math.abs(pt[k])) : m), 0);
  const xs = scaleFor(p.xUcum, xChoice, units[p.xUcum ?? ''] ?? [], maxAbs(0));
  const ys = scaleFor(p.yUcum, yChoice, units[p.yUcum ?? ''] ?? [], maxAbs(1));
  return { xs, ys, points: p.points.map(([a, b]) => [xs.toDisplay(a), ys.toDisplay(b)] as [number, number]) };
}

function UnitSelect({ label, siUcum, value, options, onChange }: {
  label: string; siUcum: string | null; value: string; options: UnitOption[]; onChange: (ucum: string) => void;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-slate-800">{label}</label>
      <select id={id} className={SELECT} value={value} disabled={!siUcum || options.length === 0} onChange={(e) => onChange(e.target.value)}>
        <option value={AUTO}>Automatic (SI prefix)</option>
        {options.map((u) => <option key={u.ucum} value={u.ucum}>{u.label}</option>)}
      </select>
    </div>
  );
}

/** The analysed files' curves: file, x and y axes, display units per quantity, and log scales. */
export function CurvesPanel({ curves, compareVersionId }: CurvesPanelProps) {
  const ids = { file: useId(), x: useId(), y: useId() };
  const [fileId, setFileId] = useState(curves.files[0]?.fileId ?? '');
  const [xName, setXName] = useState<string | null>(null);
  const [yIndex, setYIndex] = useState<number | null>(null);
  const [units, setUnits] = useState<Record<string, string>>({});
  const [logX, setLogX] = useState(false);
  const [logY, setLogY] = useState(false);

  const file = curves.files.find((f) => f.fileId === fileId) ?? curves.files[0];
  const previews = file?.previews ?? [];
  const xNames = [...new Set(previews.map((p) => p.x))];
  const x = xName && xNames.includes(xName) ? xName : xNames[0];
  const yChoices = previews.map((p, i) => ({ p, i })).filter(({ p }) => p.x === x);
  const chosen = yChoices.find(({ i }) => i === yIndex) ?? yChoices[0];
  const preview = chosen?.p;

  const xChoice = units[preview?.xUcum ?? ''] ?? AUTO;
  const yChoice = units[preview?.yUcum ?? ''] ?? AUTO;
  // Every state change here changes the plot, so the points are simply recomputed on each render.
  const view = preview ? displayed(preview, xChoice, yChoice, curves.units) : null;

  if (!file || !preview || !view) return null;
  const setUnit = (siUcum: string | null) => (ucum: string) => siUcum && setUnits((u) => ({ ...u, [siUcum]: ucum }));

  return (
    <div className="flex flex-col gap-4">
      <fieldset className="grid grid-cols-2 gap-3 sm:flex sm:flex-wrap sm:items-end sm:gap-4">
        <legend className="sr-only">What to plot</legend>
        {curves.files.length > 1 && (
          <div className="col-span-2 flex flex-col gap-1">
            <label htmlFor={ids.file} className="text-sm font-medium text-slate-800">File</label>
            <select id={ids.file} className={SELECT} value={file.fileId} onChange={(e) => { setFileId(e.target.value); setXName(null); setYIndex(null); }}>
              {curves.files.map((f) => <option key={f.fileId} value={f.fileId}>{f.fileName}</option>)}
            </select>
          </div>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.x} className="text-sm font-medium text-slate-800">x axis</label>
          <select id={ids.x} className={SELECT} value={x} onChange={(e) => { setXName(e.target.value); setYIndex(null); }}>
            {xNames.map((n) => <option key={n} value={n}>{n}</option>)}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.y} className="text-sm font-medium text-slate-800">y axis</label>
          <select id={ids.y} className={SELECT} value={String(chosen.i)} onChange={(e) => setYIndex(Number(e.target.value))}>
            {yChoices.map(({ p, i }) => <option key={i} value={String(i)}>{`${curveName(p, 'y')}${p.derived ? ' (computed)' : ''}`}</option>)}
          </select>
        </div>
        <UnitSelect label="x unit" siUcum={preview.xUcum} value={xChoice}
          options={curves.units[preview.xUcum ?? ''] ?? []} onChange={setUnit(preview.xUcum)} />
        <UnitSelect label="y unit" siUcum={preview.yUcum} value={yChoice}
          options={curves.units[preview.yUcum ?? ''] ?? []} onChange={setUnit(preview.yUcum)} />
        <div className="col-span-2 flex gap-4 sm:pb-1.5">
          <label className="flex items-center gap-2 text-sm text-slate-800">
            <input type="checkbox" checked={logX} onChange={(e) => setLogX(e.target.checked)} className="h-4 w-4 accent-copper-600" />
            Log x
          </label>
          <label className="flex items-center gap-2 text-sm text-slate-800">
            <input type="checkbox" checked={logY} onChange={(e) => setLogY(e.target.checked)} className="h-4 w-4 accent-copper-600" />
            Log y
          </label>
        </div>
      </fieldset>
      <CurvePlot points={view.points} xName={curveName(preview, 'x')} yName={curveName(preview, 'y')} xUnit={view.xs.label}
        yUnit={view.ys.label} logX={logX} logY={logY} sourcePoints={preview.sourcePoints} />
      {compareVersionId && (
        <div><AddToCompareButton versionId={compareVersionId} fileId={file.fileId} x={preview.x} y={preview.y} label="Add this curve to compare" /></div>
      )}
    </div>
  );
}
