// The overlay as a standalone SVG, built from the data (uPlot draws to a canvas only): frame, ticks and labels on
// linear or log axes, each curve in its colour and dash pattern, and a legend citing every source.
import { drawPlan } from './draw-plan';
import { citationParts } from './legend-text';
import type { PreparedCurve, PreparedOverlay } from './prepare-overlay';
import { fraction, linearScale, logScale, type AxisScale } from './ticks';

export type SvgOptions = { width?: number; plotHeight?: number; logX: boolean; logY: boolean; footer?: string };

const FONT = "'IBM Plex Sans', 'Helvetica Neue', Arial, sans-serif";
const MARGIN = { left: 96, right: 28, top: 20, bottom: 60 };
// Two lines per source: number and title, then version, DOI, group and file (clipped to the 960 px width).
const LEGEND_ROW = 38;
const TITLE_CHARS = 118;
const DETAIL_CHARS = 136;

export function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', "'": '&apos;', '"': '&quot;' })[c] as string);
}

const clip = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1)}…` : text);
const num = (v: number) => String(Math.round(v * 100) / 100);

function extent(values: number[][]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const list of values) for (const v of list) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
  return [lo, hi];
}

function scaleFor(values: number[][], log: boolean): AxisScale {
  const [lo, hi] = extent(values);
  return log ? logScale(lo, hi) : linearScale(lo, hi);
}

export function renderOverlaySvg(overlay: PreparedOverlay, options: SvgOptions): string {
  const W = options.width ?? 960;
  const plotH = options.plotHeight ?? 460;
  const plotW = W - MARGIN.left - MARGIN.right;
  const xs = scaleFor(overlay.curves.map((c) => c.x), options.logX);
  const ys = scaleFor(overlay.curves.map((c) => c.y), options.logY);
  const px = (v: number) => MARGIN.left + fraction(xs, v) * plotW;
  const py = (v: number) => MARGIN.top + (1 - fraction(ys, v)) * plotH;
  const legendRows = [
    ...overlay.curves.map((c) => ({ number: c.number, entry: c.entry, c: c as PreparedCurve | null })),
    ...overlay.excluded.map((e) => ({ number: e.number, entry: e.entry, c: null })),
  ].sort((a, b) => a.number - b.number);
  const legendTop = MARGIN.top + plotH + MARGIN.bottom;
  const H = legendTop + legendRows.length * LEGEND_ROW + (options.footer ? LEGEND_ROW + 8 : 8);
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${escapeXml(FONT)}" font-size="12">`);
  out.push(`<title>${escapeXml(`${overlay.axes.yTitle} against ${overlay.axes.xTitle}`)}</title>`);
  out.push(`<rect width="${W}" height="${H}" fill="#ffffff"/>`);
  out.push(`<defs><clipPath id="plot-area"><rect x="${MARGIN.left}" y="${MARGIN.top}" width="${plotW}" height="${plotH}"/></clipPath></defs>`);
  // Grid and ticks: labelled ticks get a grid line; unlabelled log sub-ticks only a short mark.
  for (const t of xs.ticks) {
    const x = num(px(t.value));
    if (t.label !== null) out.push(`<line x1="${x}" y1="${MARGIN.top}" x2="${x}" y2="${MARGIN.top + plotH}" stroke="#e2e8f0"/>`);
    out.push(`<line x1="${x}" y1="${MARGIN.top + plotH}" x2="${x}" y2="${MARGIN.top + plotH + (t.label !== null ? 6 : 3)}" stroke="#334155"/>`);
    if (t.label !== null) out.push(`<text x="${x}" y="${MARGIN.top + plotH + 20}" text-anchor="middle" fill="#1e293b">${escapeXml(t.label)}</text>`);
  }
  for (const t of ys.ticks) {
    const y = num(py(t.value));
    if (t.label !== null) out.push(`<line x1="${MARGIN.left}" y1="${y}" x2="${MARGIN.left + plotW}" y2="${y}" stroke="#e2e8f0"/>`);
    out.push(`<line x1="${MARGIN.left - (t.label !== null ? 6 : 3)}" y1="${y}" x2="${MARGIN.left}" y2="${y}" stroke="#334155"/>`);
    if (t.label !== null) out.push(`<text x="${MARGIN.left - 9}" y="${y}" dy="0.32em" text-anchor="end" fill="#1e293b">${escapeXml(t.label)}</text>`);
  }
  out.push(`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${plotW}" height="${plotH}" fill="none" stroke="#334155"/>`);
  out.push(`<text x="${num(MARGIN.left + plotW / 2)}" y="${MARGIN.top + plotH + 46}" text-anchor="middle" font-weight="600" fill="#0f172a">${escapeXml(overlay.axes.xTitle)}</text>`);
  out.push(`<text transform="translate(22 ${num(MARGIN.top + plotH / 2)}) rotate(-90)" text-anchor="middle" font-weight="600" fill="#0f172a">${escapeXml(overlay.axes.yTitle)}</text>`);
  out.push(`<g clip-path="url(#plot-area)" fill="none" stroke-width="1.6" stroke-linejoin="round">`);
  for (const c of overlay.curves) {
    const dash = c.style.dash.length ? ` stroke-dasharray="${c.style.dash.join(' ')}"` : '';
    const plan = drawPlan(c.x, c.y);
    if (plan.kind === 'lines') {
      for (const run of plan.runs) {
        const pts = run.x.map((x, i) => `${num(px(x))},${num(py(run.y[i]))}`).join(' ');
        out.push(`<polyline points="${pts}" stroke="${c.style.colour}"${dash}/>`);
      }
    } else {
      out.push(`<g fill="${c.style.colour}" stroke="none">${c.x.map((x, i) => `<circle cx="${num(px(x))}" cy="${num(py(c.y[i]))}" r="1.8"/>`).join('')}</g>`);
    }
  }
  out.push('</g>');
  legendRows.forEach((row, i) => {
    const y = legendTop + i * LEGEND_ROW;
    const [title, ...rest] = citationParts(row.entry);
    const detail = `${row.c ? '' : 'Not shown with these choices · '}${rest.join(' — ')}`;
    if (row.c) {
      const dash = row.c.style.dash.length ? ` stroke-dasharray="${row.c.style.dash.join(' ')}"` : '';
      out.push(`<line x1="${MARGIN.left}" y1="${y}" x2="${MARGIN.left + 44}" y2="${y}" stroke="${row.c.style.colour}" stroke-width="2"${dash}/>`);
    }
    out.push(`<text x="${MARGIN.left + 54}" y="${y}" dy="0.32em" fill="${row.c ? '#0f172a' : '#64748b'}">${escapeXml(clip(`${row.number}. ${title}`, TITLE_CHARS))}</text>`);
    out.push(`<text x="${MARGIN.left + 54}" y="${y + 15}" dy="0.32em" fill="#475569" font-size="11">${escapeXml(clip(detail, DETAIL_CHARS))}</text>`);
  });
  if (options.footer) out.push(`<text x="${MARGIN.left}" y="${H - 12}" fill="#64748b" font-size="11">${escapeXml(options.footer)}</text>`);
  out.push('</svg>');
  return out.join('\n');
}
