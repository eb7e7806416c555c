import { formatNumber } from '@/lib/format/quantity';

export type XY = readonly [number, number];

export type AlignedCurve = {
  /** uPlot's aligned data: ascending x, y with null where a point cannot be drawn. */
  data: [number[], (number | null)[]];
  /** Points left out because a log axis cannot show values ≤ 0 (or they were not finite). */
  hidden: number;
  /** True when x only ever rises or only ever falls, so joining the points in x order draws the real curve. */
  connected: boolean;
};

function monotonic(points: readonly XY[]): boolean {
  let sign = 0;
  for (let i = 1; i < points.length; i++) {
    const d = points[i][0] - points[i - 1][0];
    if (d === 0) return false;
    const s = Math.sign(d);
    if (sign !== 0 && s !== sign) return false;
    sign = s;
  }
  return true;
}

/**
 * Points as uPlot wants them (x ascending). A sweep that turns back (field up and down, warming and cooling) would
 * be scrambled by a line in x order, so it is drawn as points only.
 */
export function alignCurve(points: readonly XY[], opts: { logX?: boolean; logY?: boolean } = {}): AlignedCurve {
  const kept = points.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y) && (!opts.logX || x > 0) && (!opts.logY || y > 0));
  const connected = monotonic(kept);
  const sorted = [...kept].sort((a, b) => a[0] - b[0]);
  return { data: [sorted.map((p) => p[0]), sorted.map((p) => p[1])], hidden: points.length - kept.length, connected };
}

/** Tick labels: three significant digits, powers of ten typeset (a bare 10⁻⁵ at each decade of a log axis). */
export function tickLabels(values: readonly (number | null)[]): string[] {
  return values.map((v) => (v === null || v === undefined ? '' : formatNumber(v, 3, true)));
}

export type CurveDescription = { xName: string; yName: string; xUnit: string; yUnit: string };

/** Plain-language summary of a curve for people who cannot see the plot. */
export function describeCurve(points: readonly XY[], d: CurveDescription, sourcePoints: number): string {
  const finite = points.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
  if (finite.length === 0) return `${d.yName} against ${d.xName}: no points to show.`;
  const unit = (u: string) => (u ? ` ${u}` : '');
  const xs = finite.map((p) => p[0]);
  const ys = finite.map((p) => p[1]);
  const [xMin, xMax, yMin, yMax] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const atLowX = finite.reduce((a, b) => (b[0] < a[0] ? b : a))[1];
  const atHighX = finite.reduce((a, b) => (b[0] > a[0] ? b : a))[1];
  const span = yMax - yMin;
  const trend = span === 0 ? 'stays constant' : Math.abs(atHighX - atLowX) < 0.05 * span ? 'ends about where it starts' : atHighX > atLowX ? `rises with ${d.xName}` : `falls with ${d.xName}`;
  const count = sourcePoints > finite.length ? `${sourcePoints} points (${finite.length} shown)` : `${finite.length} points`;
  return `${d.yName} against ${d.xName}: ${count}; ${d.xName} from ${formatNumber(xMin)} to ${formatNumber(xMax)}${unit(d.xUnit)}; ${d.yName} from ${formatNumber(yMin)} to ${formatNumber(yMax)}${unit(d.yUnit)}; ${d.yName} ${trend}.`;
}
