// The overlay in uPlot's aligned form: one shared, ascending x array and one y array per drawn piece (null where a
// piece has no point). A curve that turns back is drawn as several monotonic pieces in the same style (draw-plan.ts).
import { drawPlan } from '@/lib/compare/draw-plan';
import type { PreparedCurve } from '@/lib/compare/prepare-overlay';

export type PieceSpec = { number: number; colour: string; dash: readonly number[]; kind: 'line' | 'points' };
export type OverlayData = { data: [number[], ...(number | null)[][]]; pieces: PieceSpec[] };

export function overlayData(curves: readonly PreparedCurve[]): OverlayData {
  const pieces: { spec: PieceSpec; x: number[]; y: number[] }[] = [];
  for (const c of curves) {
    const plan = drawPlan(c.x, c.y);
    const base = { number: c.number, colour: c.style.colour, dash: c.style.dash };
    if (plan.kind === 'lines') for (const run of plan.runs) pieces.push({ spec: { ...base, kind: 'line' }, x: run.x, y: run.y });
    else pieces.push({ spec: { ...base, kind: 'points' }, x: c.x, y: c.y });
  }
  const xs = Float64Array.from(new Set(pieces.flatMap((p) => p.x))).sort();
  const index = new Map<number, number>();
  xs.forEach((v, i) => index.set(v, i));
  const columns = pieces.map((p) => {
    const col: (number | null)[] = new Array(xs.length).fill(null);
    p.x.forEach((v, i) => (col[index.get(v) as number] = p.y[i]));
    return col;
  });
  return { data: [Array.from(xs), ...columns], pieces: pieces.map((p) => p.spec) };
}
