import type { QualityRule } from '../types';

export const missingGeometry: QualityRule = (c) => {
  if (c.geometryComplete !== false) return [];
  return [{
    code: 'missing-geometry',
    severity: 'warning',
    message: 'The voltage-contact spacing and cross-section (or film thickness) are not all recorded, so no resistivity or sheet resistance can be computed and the data cannot be compared with other samples.',
    rule: 'geometryComplete is false',
    source: 'common practice (ρ = R·A/L needs the voltage-contact spacing L and the cross-section A)',
  }];
};
