// Normalised curves: y divided by a reference value of the same curve, so curves of different size share one scale.
import { formatNumber } from '@/lib/format/quantity';
import type { DisplayUnit } from './units';

export type Normalisation =
  | { kind: 'none' }
  /** y / y(x): interpolated at x (SI), e.g. ρ/ρ(300 K). */
  | { kind: 'at-x'; x: number }
  /** y / y(B ≈ 0): the value at the field nearest zero (R/R(0) of a field sweep). */
  | { kind: 'zero-field' }
  /** y / max|y|. */
  | { kind: 'max' };

export type Reference = { ok: true; value: number; note: string | null } | { ok: false; reason: string };

/** An end point this close to the reference x (0.5 % of it) still counts: a ramp to 300 K often stops at 299.9 K. */
export const REACH_TOLERANCE = 0.005;
/** A field sweep must come within 2 % of its largest |B| of zero for R(0) (as lib/transport's valueAtZeroField). */
export const ZERO_FIELD_TOLERANCE = 0.02;

type Pairs = { x: number[]; y: number[] };

function finitePairs(xs: ArrayLike<number>, ys: ArrayLike<number>): Pairs {
  const out: Pairs = { x: [], y: [] };
  for (let i = 0; i < xs.length; i++) {
    if (Number.isFinite(xs[i]) && Number.isFinite(ys[i])) {
      out.x.push(xs[i]);
      out.y.push(ys[i]);
    }
  }
  return out;
}

const meanAt = (p: Pairs, x: number) => {
  let sum = 0;
  let n = 0;
  for (let i = 0; i < p.x.length; i++) if (p.x[i] === x) [sum, n] = [sum + p.y[i], n + 1];
  return sum / n;
};

/** y at x by linear interpolation between the nearest points below and above in x (branches of a loop average out). */
function interpolateAt(p: Pairs, x: number): number {
  let below = -1;
  let above = -1;
  for (let i = 0; i < p.x.length; i++) {
    if (p.x[i] <= x && (below < 0 || p.x[i] > p.x[below])) below = i;
    if (p.x[i] >= x && (above < 0 || p.x[i] < p.x[above])) above = i;
  }
  const [x0, x1] = [p.x[below], p.x[above]];
  if (x0 === x1) return meanAt(p, x0);
  const [y0, y1] = [meanAt(p, x0), meanAt(p, x1)];
  return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

export type ReferenceContext = { xUnit: DisplayUnit; xSymbol: string };

const show = (v: number, u: DisplayUnit, digits = 4) => `${formatNumber(v / u.factor, digits)}${u.label ? ` ${u.label}` : ''}`;

/** The value a curve is divided by, or why it cannot be normalised that way (shown next to the curve). */
export function referenceValue(xs: ArrayLike<number>, ys: ArrayLike<number>, norm: Normalisation, ctx: ReferenceContext): Reference {
  const p = finitePairs(xs, ys);
  if (norm.kind === 'none') return { ok: true, value: 1, note: null };
  if (p.x.length === 0) return { ok: false, reason: 'Not possible: the curve has no points.' };
  let value: number;
  let note: string | null = null;
  if (norm.kind === 'max') {
    value = p.y.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
  } else if (norm.kind === 'zero-field') {
    const maxAbs = p.x.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
    const nearest = p.x.reduce((m, v) => (Math.abs(v) < Math.abs(m) ? v : m), p.x[0]);
    if (Math.abs(nearest) > ZERO_FIELD_TOLERANCE * maxAbs) {
      return { ok: false, reason: `Not possible: the curve does not come near ${ctx.xSymbol} = 0 (nearest point at ${show(nearest, ctx.xUnit)}).` };
    }
    value = meanAt(p, nearest);
    if (nearest !== 0) note = `Reference taken at ${ctx.xSymbol} = ${show(nearest, ctx.xUnit)}, the point nearest zero.`;
  } else {
    // A loop, not Math.min(...x): full-resolution curves have millions of points.
    const lo = p.x.reduce((m, v) => Math.min(m, v), Infinity);
    const hi = p.x.reduce((m, v) => Math.max(m, v), -Infinity);
    const slack = REACH_TOLERANCE * Math.abs(norm.x);
    if (norm.x < lo - slack || norm.x > hi + slack) {
      return {
        ok: false,
        reason: `Not possible: the curve does not reach ${show(norm.x, ctx.xUnit)} (its ${ctx.xSymbol} spans ${show(lo, ctx.xUnit)} – ${show(hi, ctx.xUnit)}).`,
      };
    }
    if (norm.x < lo || norm.x > hi) {
      const end = norm.x < lo ? lo : hi;
      value = meanAt(p, end);
      // A gap below 0.01 % (0.03 K at 300 K) is thermometer noise, not worth a note.
      if (Math.abs(end - norm.x) > 1e-4 * Math.abs(norm.x)) {
        note = `Reference taken at ${ctx.xSymbol} = ${show(end, ctx.xUnit, 6)}, the end of the curve nearest ${show(norm.x, ctx.xUnit)}.`;
      }
    } else value = interpolateAt(p, norm.x);
  }
  if (!Number.isFinite(value) || value === 0) return { ok: false, reason: 'Not possible: the reference value is zero.' };
  return { ok: true, value, note };
}

/** The normalised axis title: ρ/ρ(300 K), R/R(B = 0), ρ/max|ρ|. */
export function normalisedLabel(norm: Normalisation, ySymbol: string, ctx: ReferenceContext): string {
  switch (norm.kind) {
    case 'none': return ySymbol;
    case 'at-x': return `${ySymbol}/${ySymbol}(${show(norm.x, ctx.xUnit)})`;
    case 'zero-field': return `${ySymbol}/${ySymbol}(${ctx.xSymbol} = 0)`;
    case 'max': return `${ySymbol}/max|${ySymbol}|`;
  }
}
