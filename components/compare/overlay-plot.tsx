'use client';

import 'uplot/dist/uPlot.min.css';
import { useEffect, useMemo, useRef, useState } from 'react';
import type uPlot from 'uplot';
import { tickLabels } from '@/components/plot/plot-data';
import { formatNumber } from '@/lib/format/quantity';
import type { PreparedOverlay } from '@/lib/compare/prepare-overlay';
import { overlayData } from './overlay-data';

export type OverlayPlotProps = { overlay: PreparedOverlay; logX: boolean; logY: boolean; height: number };

const AXIS = {
  stroke: '#334155', grid: { stroke: '#e2e8f0', width: 1 }, ticks: { stroke: '#cbd5e1', width: 1 },
  font: '12px var(--font-plex-sans), sans-serif', labelFont: '600 12px var(--font-plex-sans), sans-serif',
};

/** A plain-language summary of the overlay for people who cannot see the canvas. */
function describe(overlay: PreparedOverlay): string {
  const { axes, curves } = overlay;
  if (curves.length === 0) return 'No curve to draw.';
  const parts = curves.map((c) => {
    const lo = Math.min(...c.x);
    const hi = Math.max(...c.x);
    return `curve ${c.number} (${c.style.dashName} line) from ${formatNumber(lo)} to ${formatNumber(hi)} ${axes.xUnit.label}`;
  });
  return `${axes.yTitle} against ${axes.xTitle}, ${curves.length} curve${curves.length === 1 ? '' : 's'}: ${parts.join('; ')}.`;
}

/**
 * Several curves in one uPlot chart (loaded in the browser only; uPlot draws on a canvas). Each curve keeps its
 * colour and dash pattern; the legend is the page's own, with the citations. Drag to zoom, double-click to reset.
 */
export function OverlayPlot({ overlay, logX, logY, height }: OverlayPlotProps) {
  const holder = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const built = useMemo(() => overlayData(overlay.curves), [overlay]);
  const summary = describe(overlay);

  useEffect(() => {
    const el = holder.current;
    if (!el || built.pieces.length === 0) return;
    let plot: uPlot | undefined;
    let cancelled = false;
    const observer = new ResizeObserver(() => plot?.setSize({ width: el.clientWidth, height }));
    import('uplot')
      .then(({ default: UPlot }) => {
        if (cancelled) return;
        const value = (_u: uPlot, v: number | null) => (v === null ? '—' : formatNumber(v, 4));
        const opts: uPlot.Options = {
          width: el.clientWidth || 600,
          height,
          legend: { show: false },
          scales: { x: { time: false, distr: logX ? 3 : 1, log: 10 }, y: { distr: logY ? 3 : 1, log: 10 } },
          axes: [
            { ...AXIS, label: overlay.axes.xTitle, values: (_u, splits) => tickLabels(splits) },
            { ...AXIS, label: overlay.axes.yTitle, size: 76, values: (_u, splits) => tickLabels(splits) },
          ],
          series: [
            { label: overlay.axes.xTitle, value },
            ...built.pieces.map((p): uPlot.Series => ({
              label: `curve ${p.number}`,
              stroke: p.colour,
              width: 1.75,
              dash: [...p.dash],
              spanGaps: true,
              value,
              ...(p.kind === 'line'
                ? { points: { show: false } }
                : { paths: () => null, points: { show: true, size: 4, fill: p.colour, stroke: p.colour } }),
            })),
          ],
          cursor: { drag: { x: true, y: true, uni: 20 } },
        };
        plot = new UPlot(opts, built.data as uPlot.AlignedData, el);
        observer.observe(el);
      })
      .catch((e: unknown) => setFailed(`The plot could not be drawn (${e instanceof Error ? e.message : String(e)}). The exports still work.`));
    return () => {
      cancelled = true;
      observer.disconnect();
      plot?.destroy();
    };
  }, [built, height, logX, logY, overlay.axes.xTitle, overlay.axes.yTitle]);

  return (
    <figure className="flex flex-col gap-2">
      <div ref={holder} role="img" aria-label={summary} className="w-full overflow-hidden" style={{ height }} />
      {failed && <p role="alert" className="text-sm text-red-800">{failed}</p>}
      <figcaption className="text-xs text-slate-600">Drag across the plot to zoom; double-click to reset.</figcaption>
    </figure>
  );
}
