export { summariseTable, type SummariseTableOptions } from './summarise-table';
export { downsampleCurve } from './preview';
export { SUMMARY_VERSION } from './types';
export type { ColumnSummary, CurvePreview, DerivedValue, FileSummary, GeometrySummary, SweepInfo } from './types';
