import type { QualityFlag } from '@/lib/transport/quality';
import type { ColumnRole, DecimalSeparator, Delimiter, ParseWarning, TransportQuantity } from '@/lib/transport/parse';

export const SUMMARY_VERSION = '1.0.0';

export type ColumnSummary = {
  index: number;
  name: string;
  rawHeader: string;
  quantity: TransportQuantity;
  role: ColumnRole;
  ucum: string | null;
  siUcum: string | null;
  converted: boolean;
  confidence: number;
  reason: string;
  /** Finite range in siUcum (or in the file's unit when not converted); null when every value is NaN. */
  range: { min: number; max: number } | null;
  nanCount: number;
};

/** One computed number, in `ucum`, with how it was obtained. */
export type DerivedValue = {
  key: string;
  label: string;
  value: number;
  ucum: string;
  /** Formula in words with its source, e.g. "ρ = R·A/L (definition of resistivity)". */
  method: string;
  /** Where on the curve it applies, e.g. { temperatureK: 4.2 }. */
  at?: Record<string, number>;
  detail?: Record<string, number | string | boolean>;
};

/** A curve downsampled for plotting (LTTB, Steinarsson 2013), values in SI. */
export type CurvePreview = {
  x: string;
  y: string;
  xUcum: string | null;
  yUcum: string | null;
  /** Points in the full curve (finite pairs) and in this preview. */
  sourcePoints: number;
  points: [number, number][];
  derived: boolean;
};

export type SweepInfo = {
  variable: 'temperature' | 'field' | 'angle' | 'current' | 'time' | 'gate-voltage' | 'other' | null;
  from: 'metadata' | 'data' | 'none';
};

export type FileSummary = {
  summaryVersion: typeof SUMMARY_VERSION;
  fileName: string | null;
  bytes: number;
  encoding: string;
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  rowCount: number;
  truncated: boolean;
  headerMetadata: Record<string, string>;
  columns: ColumnSummary[];
  sweep: SweepInfo;
  geometry: GeometrySummary | null;
  derived: DerivedValue[];
  /** Why a derived quantity a reader might expect was not computed. */
  notComputed: { key: string; reason: string }[];
  quality: QualityFlag[];
  previews: CurvePreview[];
  warnings: ParseWarning[];
};

export type GeometrySummary = {
  lengthM: number | null;
  areaM2: number | null;
  widthM: number | null;
  thicknessM: number | null;
  /** How the cross-section was obtained. */
  areaFrom: 'cross-section-area' | 'width-thickness' | 'diameter' | null;
};
