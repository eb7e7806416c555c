import { excitationHeating } from './rules/heating';
import { lockInTooSlowForSweep } from './rules/lock-in-settling';
import { mainsHarmonic } from './rules/mains';
import { missingGeometry } from './rules/geometry';
import { implausibleValues } from './rules/plausibility';
import { dcWithoutReversal } from './rules/thermoelectric';
import { negativeResistance, twoWireLowResistance } from './rules/wiring';
import type { MeasurementContext, QualityFlag, QualityRule } from './types';

const RULES: readonly QualityRule[] = [
  twoWireLowResistance,
  negativeResistance,
  mainsHarmonic,
  dcWithoutReversal,
  excitationHeating,
  lockInTooSlowForSweep,
  missingGeometry,
  implausibleValues,
];

const ORDER = { serious: 0, warning: 1, info: 2 } as const;

/** Advisory quality flags for a measurement, most severe first; flags advise and never block. */
export function assessMeasurement(context: MeasurementContext): QualityFlag[] {
  return RULES.flatMap((rule) => rule(context)).sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
}
