import { describe, expect, it } from 'vitest';
import { assessMeasurement, type QualityFlag } from '@/lib/transport/quality';

const codes = (flags: QualityFlag[]) => flags.map((f) => f.code);
const only = (flags: QualityFlag[], code: string) => {
  const hit = flags.filter((f) => f.code === code);
  expect(hit, code).toHaveLength(1);
  return hit[0];
};

describe('assessMeasurement', () => {
  it('returns no flags for a clean four-wire AC measurement', () => {
    const flags = assessMeasurement({
      mode: 'four-wire', excitation: 'ac', frequencyHz: 13.7, currentA: 1e-6, detection: 'digital-lock-in', timeConstantS: 0.3,
      filterOrder: 2, sweep: { variable: 'temperature', ratePerS: 1 / 60, pointIntervalS: 3 }, geometryComplete: true,
      resistanceOhm: { min: 0.1, max: 12 }, voltageV: { min: 1e-7, max: 1.2e-5 }, temperatureK: { min: 2, max: 300 },
      resistivityOhmM: { min: 1e-10, max: 1.7e-8 }, carrierDensityPerM3: 8.47e28, mobilityM2PerVs: 4.4e-3,
    });
    expect(flags).toEqual([]);
  });

  it('every flag has severity, message, rule and source', () => {
    const flags = assessMeasurement({ mode: 'two-wire', resistanceOhm: { min: 1, max: 5 }, excitation: 'dc', voltageV: { min: 1e-6, max: 5e-6 }, geometryComplete: false });
    expect(flags.length).toBeGreaterThanOrEqual(3);
    for (const f of flags) {
      expect(['info', 'warning', 'serious']).toContain(f.severity);
      for (const key of ['code', 'message', 'rule', 'source'] as const) expect(f[key].length, `${f.code}.${key}`).toBeGreaterThan(3);
    }
    expect(flags[0].severity).toBe('serious'); // most severe first
  });

  describe('two-wire on a low resistance (common practice: four-wire for low and moderate R)', () => {
    it('is serious below 1 kΩ and names the resistance', () => {
      const f = only(assessMeasurement({ mode: 'two-wire', resistanceOhm: { min: 2, max: 5.2 } }), 'two-wire-low-resistance');
      expect(f.severity).toBe('serious');
      expect(f.message).toContain('5.2 Ω');
      expect(f.source).toMatch(/common practice/);
    });
    it('is a warning up to 100 kΩ and silent above, and for four-wire', () => {
      expect(only(assessMeasurement({ mode: 'two-wire', resistanceOhm: { min: 1e3, max: 4.7e4 } }), 'two-wire-low-resistance').severity).toBe('warning');
      expect(assessMeasurement({ mode: 'two-wire', resistanceOhm: { min: 1e6, max: 1e9 } })).toEqual([]);
      expect(assessMeasurement({ mode: 'four-wire', resistanceOhm: { min: 0.1, max: 1 } })).toEqual([]);
    });
  });

  describe('mains harmonics (common practice: 13.7 Hz or 17.77 Hz rather than 50/60 Hz multiples)', () => {
    it('is serious on a harmonic and says which', () => {
      const f = only(assessMeasurement({ excitation: 'ac', frequencyHz: 150 }), 'ac-on-mains-harmonic');
      expect(f.severity).toBe('serious');
      expect(f.message).toMatch(/harmonic 3 of the 50 Hz mains \(150 Hz\)/);
      expect(only(assessMeasurement({ excitation: 'ac', frequencyHz: 60 }), 'ac-on-mains-harmonic').message).toMatch(/the 60 Hz mains/);
    });
    it('warns near a harmonic (within 1 Hz, or 2 × the filter ENBW)', () => {
      expect(only(assessMeasurement({ excitation: 'ac', frequencyHz: 119.3 }), 'ac-near-mains-harmonic').message).toMatch(/0\.7 Hz from/);
      expect(codes(assessMeasurement({ excitation: 'ac', frequencyHz: 103 }))).toEqual([]);
      // τ = 0.03 s, 1 pole: ENBW = 8.33 Hz, so 103 Hz is inside the passband around 100 Hz
      expect(codes(assessMeasurement({ excitation: 'ac', frequencyHz: 103, timeConstantS: 0.03, filterOrder: 1 }))).toEqual(['ac-near-mains-harmonic']);
    });
    it('passes the usual lab frequencies and respects a given mains frequency', () => {
      for (const f of [13.7, 17.77, 7.77, 37.3]) expect(assessMeasurement({ excitation: 'ac', frequencyHz: f }), `${f} Hz`).toEqual([]);
      expect(assessMeasurement({ excitation: 'ac', frequencyHz: 120, mainsHz: 50 })).toEqual([]);
    });
  });

  describe('DC without reversal on small signals (common practice, delta method)', () => {
    it('is serious below 10 µV, a warning below 1 mV, with the voltage in µV', () => {
      const f = only(assessMeasurement({ excitation: 'dc', voltageV: { min: -2e-6, max: 3.4e-6 } }), 'dc-without-reversal');
      expect(f.severity).toBe('serious');
      expect(f.message).toContain('3.4 µV');
      expect(only(assessMeasurement({ excitation: 'dc', voltageV: { min: 0, max: 2e-4 } }), 'dc-without-reversal').severity).toBe('warning');
    });
    it('is silent with reversal or larger signals', () => {
      expect(assessMeasurement({ excitation: 'dc-reversal', voltageV: { min: 0, max: 1e-6 } })).toEqual([]);
      expect(assessMeasurement({ excitation: 'dc', voltageV: { min: 0, max: 0.01 } })).toEqual([]);
    });
  });

  describe('excitation heating (common practice), with a safety note', () => {
    it('warns of 1 µW at 2 K: 100 µA through 100 Ω', () => {
      const f = only(assessMeasurement({ currentA: 1e-4, resistanceOhm: { min: 50, max: 100 }, temperatureK: { min: 2, max: 20 } }), 'excitation-heating');
      expect(f.severity).toBe('warning');
      expect(f.message).toContain('1 µW');
      expect(f.message).toContain('2 K');
      expect(f.safety).toMatch(/local lab rules/);
    });
    it('below 1 K: 20 nW is a warning and 2 µW serious; the same power at room temperature is silent', () => {
      expect(only(assessMeasurement({ currentA: 1e-6, resistanceOhm: { min: 1e4, max: 2e4 }, temperatureK: { min: 0.02, max: 1 } }), 'excitation-heating').severity).toBe('warning'); // 20 nW
      expect(only(assessMeasurement({ currentA: 1e-5, resistanceOhm: { min: 1e4, max: 2e4 }, temperatureK: { min: 0.02, max: 1 } }), 'excitation-heating').severity).toBe('serious'); // 2 µW
      expect(assessMeasurement({ currentA: 1e-4, resistanceOhm: { min: 50, max: 100 }, temperatureK: { min: 290, max: 300 } })).toEqual([]);
    });
  });

  describe('lock-in time constant against the sweep (99 % settling of an n-pole filter)', () => {
    it('warns when t₉₉ exceeds the point interval and reports the lag in practitioner units', () => {
      // 4 poles, τ = 1 s: t₉₉ = 10.0 s; points every 2 s; 10 mT/s → lag 4τ·rate = 40 mT
      const f = only(assessMeasurement({ detection: 'analog-lock-in', timeConstantS: 1, filterOrder: 4, sweep: { variable: 'field', ratePerS: 0.01, pointIntervalS: 2 } }), 'lock-in-time-constant-too-long');
      expect(f.severity).toBe('warning');
      expect(f.message).toContain('10 s');
      expect(f.message).toContain('40 mT');
    });
    it('is serious past 10 × the interval and assumes at least one pole when the order is unknown', () => {
      const f = only(assessMeasurement({ detection: 'digital-lock-in', timeConstantS: 3, sweep: { variable: 'temperature', ratePerS: 0.05, pointIntervalS: 1 } }), 'lock-in-time-constant-too-long');
      expect(f.severity).toBe('serious'); // 1 pole: 4.61 × 3 s = 13.8 s > 10 s
      expect(f.message).toMatch(/at least 1-pole/);
      expect(f.message).toContain('13.8 s');
      expect(f.message).toContain('150 mK');
    });
    it('is silent when settled; only an info on lag without a point interval', () => {
      expect(assessMeasurement({ detection: 'analog-lock-in', timeConstantS: 0.1, filterOrder: 2, sweep: { variable: 'field', ratePerS: 0.01, pointIntervalS: 1 } })).toEqual([]);
      const info = only(assessMeasurement({ detection: 'analog-lock-in', timeConstantS: 0.1, filterOrder: 2, sweep: { variable: 'angle', ratePerS: Math.PI / 180 } }), 'lock-in-sweep-lag');
      expect(info.severity).toBe('info');
      expect(info.message).toContain('0.2°');
    });
  });

  it('flags missing geometry', () => {
    expect(only(assessMeasurement({ geometryComplete: false }), 'missing-geometry').message).toMatch(/no resistivity/);
    expect(assessMeasurement({ geometryComplete: true })).toEqual([]);
  });

  describe('implausible values', () => {
    it('negative four-wire resistance is only information; negative two-wire is serious', () => {
      expect(only(assessMeasurement({ mode: 'four-wire', resistanceOhm: { min: -0.002, max: 1 } }), 'negative-four-wire-resistance').severity).toBe('info');
      expect(only(assessMeasurement({ mode: 'two-wire', resistanceOhm: { min: -5, max: 1e6 } }), 'negative-two-wire-resistance').severity).toBe('serious');
    });
    it('resistivity below 1e-9 Ω·m above 200 K (silver 1.587e-8 Ω·m at 293 K, CRC Handbook, from memory)', () => {
      const f = only(assessMeasurement({ resistivityOhmM: { min: 1.7e-11, max: 1.7e-10 }, temperatureK: { min: 250, max: 300 } }), 'resistivity-too-low');
      expect(f.severity).toBe('serious');
      expect(f.message).toContain('0.0017 µΩ·cm');
      expect(assessMeasurement({ resistivityOhmM: { min: 1.7e-11, max: 1.7e-8 }, temperatureK: { min: 2, max: 300 } })).toEqual([]); // low value at 2 K is fine
      expect(only(assessMeasurement({ resistivityOhmM: { min: 1e-13, max: 5e-10 }, temperatureK: { min: 2, max: 300 } }), 'resistivity-too-low').message).toContain('even at 300 K');
      expect(assessMeasurement({ resistivityOhmM: { min: 1.587e-8, max: 1.6e-8 }, temperatureK: { min: 293, max: 293 } })).toEqual([]);
    });
    it('does not flag the good conductors at 293 K: Cu 1.678, Ag 1.587, Au 2.214, Al 2.650 ×1e-8 Ω·m (CRC Handbook, from memory) or IACS Cu 1.72414 µΩ·cm (IEC 60028)', () => {
      for (const rho of [1.678e-8, 1.587e-8, 2.214e-8, 2.65e-8, 1.72414e-8]) {
        expect(assessMeasurement({ resistivityOhmM: { min: rho, max: rho }, temperatureK: { min: 293, max: 293 } }), `${rho}`).toEqual([]);
        // a thickness entered in mm instead of µm makes the same metal read 1000× too low: flagged
        expect(codes(assessMeasurement({ resistivityOhmM: { min: rho / 1000, max: rho / 1000 }, temperatureK: { min: 293, max: 293 } }))).toEqual(['resistivity-too-low']);
      }
    });
    it('resistivity above 1e10 Ω·m', () => {
      expect(only(assessMeasurement({ resistivityOhmM: { min: 1e9, max: 3e12 } }), 'resistivity-very-high').severity).toBe('warning');
    });
    it('carrier density outside 1e12…1e30 m⁻³, mobility above 1e4 m²/(V·s), negative kelvin', () => {
      expect(only(assessMeasurement({ carrierDensityPerM3: 8.47e34 }), 'carrier-density-implausible').message).toContain('8.47e+28 cm⁻³');
      expect(assessMeasurement({ carrierDensityPerM3: -3.12e23 })).toEqual([]);
      expect(only(assessMeasurement({ mobilityM2PerVs: -4.4e4 }), 'mobility-implausible').message).toContain('4.4e+8 cm²/(V·s)');
      expect(only(assessMeasurement({ temperatureK: { min: -12, max: 25 } }), 'negative-kelvin').severity).toBe('serious');
    });
  });
});
