import type { TransportDatasetDraft } from '@/lib/schema';
import type { ParsedColumn, TransportQuantity } from '@/lib/transport/parse';
import type { MeasurementContext } from '@/lib/transport/quality';
import { binByX, binByXWithM4, type XY } from './curves';
import { m4Buckets, type M4 } from './preview';
import type { DerivedValue, GeometrySummary, SweepInfo } from './types';

/** A derived curve over the x column, values in SI `ucum`, kept for previews and later derivations. */
export type DerivedCurve = { name: string; quantity: TransportQuantity; ucum: string; x: Float64Array; y: Float64Array };

/** Everything the derivation steps read, and where they put their results. */
export type Derivation = {
  columns: ParsedColumn[];
  x: ParsedColumn | null;
  sweep: SweepInfo;
  geometry: GeometrySummary | null;
  metadata: TransportDatasetDraft | undefined;
  currentA: number | null;
  derived: DerivedValue[];
  notComputed: { key: string; reason: string }[];
  curves: DerivedCurve[];
  context: MeasurementContext;
  /** Points of the previews (LTTB target), when the summary makes previews (see m4). */
  previewPoints?: number;
  /** With previewPoints: M4 candidates of (x, y) column curves, collected by binned() for the previews. */
  m4?: { x: Float64Array; y: Float64Array; m4: M4 }[];
};

export function firstColumn(d: Derivation, quantity: TransportQuantity): ParsedColumn | undefined {
  return d.columns.find((c) => c.quantity === quantity && c.converted && c.range !== null);
}

export function curveOf(d: Derivation, name: string): DerivedCurve | undefined {
  return d.curves.find((c) => c.name === name);
}

export const round = (v: number, digits = 7) => Number(v.toPrecision(digits));

/**
 * binByX over two arrays. When both are whole columns with neither NaN nor ±Infinity, every pair is finite and the
 * x column's range (kept while parsing, the first of equal values as binByX keeps them) is what binByX's first pass
 * would find, so that pass is skipped.
 */
export function binned(d: Derivation, x: Float64Array, y: Float64Array): XY {
  const cx = d.columns.find((c) => c.values === x);
  const cy = d.columns.find((c) => c.values === y);
  const allFinite = cx && cy && cx.range && cx.nanCount + cx.infiniteCount + cy.nanCount + cy.infiniteCount === 0 && x.length === y.length;
  const known = allFinite && cx.range ? { lo: cx.range.min, hi: cx.range.max, n: x.length } : null;
  // A curve over the x column is also previewed: collect its M4 candidates in the same pass.
  const collected = d.m4;
  if (known && collected && d.previewPoints && x === d.x?.values && !collected.some((m) => m.x === x && m.y === y)) {
    const both = binByXWithM4(x, y, BINS, known, m4Buckets(x.length, d.previewPoints));
    if (both) {
      collected.push({ x, y, m4: both.m4 });
      return both.binned;
    }
  }
  return binByX(x, y, BINS, known);
}

/** M4 candidates binned() collected for the preview of y over x, if any. */
export function collectedM4(d: Derivation, x: Float64Array, y: Float64Array): M4 | undefined {
  return d.m4?.find((m) => m.x === x && m.y === y)?.m4;
}

const BINS = 4000; // binByX's default
