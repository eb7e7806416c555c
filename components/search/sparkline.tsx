/** The main curve of a result as a small SVG line (shape only: the card names the axes in words). */
export function Sparkline({ points, label }: { points: [number, number][]; label: string }) {
  const finite = points.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
  if (finite.length < 2) return null;
  const xs = finite.map(([x]) => x);
  const ys = finite.map(([, y]) => y);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const w = 120;
  const h = 36;
  const sx = (x: number) => (x1 === x0 ? w / 2 : ((x - x0) / (x1 - x0)) * w);
  const sy = (y: number) => (y1 === y0 ? h / 2 : h - 2 - ((y - y0) / (y1 - y0)) * (h - 4));
  const d = finite.map(([x, y], i) => `${i ? 'L' : 'M'}${sx(x).toFixed(1)},${sy(y).toFixed(1)}`).join('');
  return (
    <svg viewBox={`0 0 ${w} ${h}`} width={w} height={h} role="img" aria-label={label} className="shrink-0 rounded bg-slate-50">
      <path d={d} fill="none" stroke="currentColor" strokeWidth="1.5" className="text-copper-700" />
    </svg>
  );
}
