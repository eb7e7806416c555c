export type { MeasurementContext, QualityFlag, QualitySeverity, Range } from './types';
export { assessMeasurement } from './assess-measurement';
