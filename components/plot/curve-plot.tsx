'use client';

import 'uplot/dist/uPlot.min.css';
import { useEffect, useMemo, useRef, useState } from 'react';
import type uPlot from 'uplot';
import { formatNumber } from '@/lib/format/quantity';
import { alignCurve, describeCurve, tickLabels, type XY } from './plot-data';

export type CurvePlotProps = {
  /** Points in the units of the axis labels. */
  points: readonly XY[];
  xName: string;
  yName: string;
  xUnit: string;
  yUnit: string;
  logX?: boolean;
  logY?: boolean;
  /** Points in the full curve (the preview may be downsampled). */
  sourcePoints?: number;
  height?: number;
};

const COPPER = '#9a4f23';
const AXIS = { stroke: '#334155', grid: { stroke: '#e2e8f0', width: 1 }, ticks: { stroke: '#cbd5e1', width: 1 }, font: '12px var(--font-plex-sans), sans-serif', labelFont: '600 12px var(--font-plex-sans), sans-serif' };
const axisLabel = (name: string, unit: string) => (unit ? `${name} (${unit})` : name);

/**
 * One curve in uPlot, loaded in the browser only (uPlot needs a canvas), with a text summary beside it and the
 * points as a table for people who cannot see the plot. Drag to zoom, double-click to reset.
 */
export function CurvePlot({ points, xName, yName, xUnit, yUnit, logX = false, logY = false, sourcePoints, height = 320 }: CurvePlotProps) {
  const holder = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const curve = useMemo(() => alignCurve(points, { logX, logY }), [points, logX, logY]);
  const summary = describeCurve(points, { xName, yName, xUnit, yUnit }, sourcePoints ?? points.length);

  useEffect(() => {
    const el = holder.current;
    if (!el) return;
    let plot: uPlot | undefined;
    let cancelled = false;
    const observer = new ResizeObserver(() => plot?.setSize({ width: el.clientWidth, height }));
    import('uplot')
      .then(({ default: UPlot }) => {
        if (cancelled) return;
        const opts: uPlot.Options = {
          width: el.clientWidth || 600,
          height,
          scales: { x: { time: false, distr: logX ? 3 : 1, log: 10 }, y: { distr: logY ? 3 : 1, log: 10 } },
          axes: [
            { ...AXIS, label: axisLabel(xName, xUnit), values: (_u, splits) => tickLabels(splits) },
            { ...AXIS, label: axisLabel(yName, yUnit), size: 72, values: (_u, splits) => tickLabels(splits) },
          ],
          series: [
            { label: axisLabel(xName, xUnit), value: (_u, v) => (v === null ? '—' : formatNumber(v, 4)) },
            {
              label: axisLabel(yName, yUnit),
              stroke: COPPER,
              width: 1.5,
              value: (_u, v) => (v === null ? '—' : formatNumber(v, 4)),
              points: { show: !curve.connected || curve.data[0].length < 40, size: 4, fill: COPPER },
              ...(curve.connected ? {} : { paths: () => null }),
            },
          ],
          cursor: { drag: { x: true, y: true, uni: 20 } },
        };
        plot = new UPlot(opts, curve.data, el);
        observer.observe(el);
      })
      .catch((e: unknown) => setFailed(`The plot could not be drawn (${e instanceof Error ? e.message : String(e)}).`));
    return () => {
      cancelled = true;
      observer.disconnect();
      plot?.destroy();
    };
  }, [curve, height, logX, logY, xName, yName, xUnit, yUnit]);

  return (
    <figure className="flex flex-col gap-2">
      <div ref={holder} role="img" aria-label={summary} className="min-h-[200px] w-full" style={{ height: height + 40 }} />
      {failed && <p role="alert" className="text-sm text-red-700">{failed}</p>}
      <figcaption className="text-sm text-slate-700">
        {summary}
        {curve.hidden > 0 && ` ${curve.hidden} point${curve.hidden === 1 ? '' : 's'} at or below zero cannot be shown on a log axis.`}
        {!curve.connected && ' The sweep turns back, so points are drawn without a line.'}
        <span className="text-slate-500"> Drag to zoom; double-click to reset.</span>
      </figcaption>
      <details className="text-sm">
        <summary className="cursor-pointer text-copper-700">Points as a table</summary>
        <div className="mt-2 max-h-64 overflow-y-auto rounded border border-slate-200">
          <table className="num w-full text-right text-xs">
            <thead className="sticky top-0 bg-slate-50"><tr><th scope="col" className="px-2 py-1">{axisLabel(xName, xUnit)}</th><th scope="col" className="px-2 py-1">{axisLabel(yName, yUnit)}</th></tr></thead>
            <tbody>
              {points.map(([x, y], i) => (
                <tr key={i} className="border-t border-slate-100"><td className="px-2 py-0.5">{formatNumber(x, 4)}</td><td className="px-2 py-0.5">{formatNumber(y, 4)}</td></tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
