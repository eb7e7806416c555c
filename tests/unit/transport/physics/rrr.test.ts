import { describe, expect, it } from 'vitest';
import { residualResistivityRatio } from '@/lib/transport/physics';

// RRR = ρ(273 K)/ρ(4.2 K), also 300 K in many labs: record which (Splett et al., J. Res. NIST 116, 489 (2011); IEC 61788-4).
describe('residual resistivity ratio', () => {
  const t = [2, 4.2, 10, 50, 100, 200, 273, 300];
  const rho = [1e-10, 1e-10, 1.05e-10, 2e-9, 3.5e-9, 1.05e-8, 1.55e-8, 1.72e-8];

  it('uses 273 K and 4.2 K by default and records them', () => {
    const r = residualResistivityRatio(t, rho);
    expect(r.rrr).toBeCloseTo(155, 10);
    expect(r.high).toEqual({ requestedK: 273, usedK: 273, value: 1.55e-8, extrapolated: false });
    expect(r.low).toEqual({ requestedK: 4.2, usedK: 4.2, value: 1e-10, extrapolated: false });
  });

  it('interpolates linearly at 300 K when asked, and between points', () => {
    expect(residualResistivityRatio(t, rho, { highK: 300 }).rrr).toBeCloseTo(172, 10);
    const mid = residualResistivityRatio(t, rho, { highK: 286.5 });
    expect(mid.high.value).toBeCloseTo((1.55e-8 + 1.72e-8) / 2, 20);
  });

  it('uses 300 K when the data cover 300 K but not 273 K', () => {
    const r = residualResistivityRatio([280, 290, 300, 310], [1, 2, 3, 4]);
    expect(r.high.requestedK).toBe(300);
    expect(r.high.extrapolated).toBe(false);
  });

  it('flags extrapolation: linear above the data, plateau held below it', () => {
    const r = residualResistivityRatio([10, 100, 250, 260], [1, 3, 9, 9.4]);
    expect(r.high).toMatchObject({ requestedK: 273, extrapolated: true });
    expect(r.high.value).toBeCloseTo(9.4 + 13 * 0.04, 12);
    expect(r.low).toEqual({ requestedK: 4.2, usedK: 10, value: 1, extrapolated: true });
  });

  it('accepts unsorted input', () => {
    expect(residualResistivityRatio([...t].reverse(), [...rho].reverse()).rrr).toBeCloseTo(155, 10);
  });
});
