import type { TransportDatasetDraft } from '@/lib/schema';
import type { ParsedColumn, TransportQuantity } from '@/lib/transport/parse';
import type { MeasurementContext } from '@/lib/transport/quality';
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
};

export function firstColumn(d: Derivation, quantity: TransportQuantity): ParsedColumn | undefined {
  return d.columns.find((c) => c.quantity === quantity && c.converted && c.range !== null);
}

export function curveOf(d: Derivation, name: string): DerivedCurve | undefined {
  return d.curves.find((c) => c.name === name);
}

export const round = (v: number, digits = 7) => Number(v.toPrecision(digits));
