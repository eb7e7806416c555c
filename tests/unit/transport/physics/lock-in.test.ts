import { describe, expect, it } from 'vitest';
import { demodulate } from '@/lib/transport/physics';

// Test waveform (domain.md): A = 1, θ = 30°, plus 0.3 at 3f and 0.05 DC (Scofield, Am. J. Phys. 62, 129 (1994)).
function waveform(periods: number, samplesPerPeriod: number, f = 17.77): { samples: number[]; fs: number } {
  const fs = f * samplesPerPeriod;
  const n = Math.round(periods * samplesPerPeriod);
  const samples = Array.from({ length: n }, (_, k) => {
    const ph = (2 * Math.PI * k) / samplesPerPeriod;
    return Math.sin(ph + Math.PI / 6) + 0.3 * Math.sin(3 * ph) + 0.05;
  });
  return { samples, fs };
}

describe('digital lock-in demodulation', () => {
  it('10 whole periods → X = 0.866025403784, Y = 0.5 to 1e-12 (Scofield 1994)', () => {
    const { samples, fs } = waveform(10, 100);
    const r = demodulate({ samples, sampleRateHz: fs, referenceHz: 17.77 });
    expect(Math.abs(r.x - 0.866025403784)).toBeLessThan(1e-12);
    expect(Math.abs(r.y - 0.5)).toBeLessThan(1e-12);
    expect(r.r).toBeCloseTo(1, 12);
    expect(r.thetaDeg).toBeCloseTo(30, 10);
    expect(r.periods).toBe(10);
    expect(r.samplesUsed).toBe(1000);
    expect(r.enbwHz).toBeCloseTo(1 / (2 * (10 / 17.77)), 12); // boxcar over T = 10 periods: 1/(2T)
  });

  it('10.5 periods: truncated to 10 whole periods gives 30°; integrating all gives ≈ 29.91° (Scofield 1994)', () => {
    const { samples, fs } = waveform(10.5, 1000); // fine sampling approaches the continuous-time 29.913°
    const whole = demodulate({ samples, sampleRateHz: fs, referenceHz: 17.77 });
    expect(whole.periods).toBe(10);
    expect(whole.samplesUsed).toBe(10000);
    expect(whole.thetaDeg).toBeCloseTo(30, 10);
    const all = demodulate({ samples, sampleRateHz: fs, referenceHz: 17.77, wholePeriods: false });
    expect(all.thetaDeg).toBeCloseTo(29.91, 2);
    expect(all.periods).toBeCloseTo(10.5, 12);
  });

  it('a pure off-frequency sine demodulates to ≈ 0 (rejection away from f)', () => {
    const fRef = 13.7;
    const fs = fRef * 64;
    const n = 64 * 200;
    for (const fSignal of [50, 60, 2 * fRef, 31.3]) {
      const samples = Array.from({ length: n }, (_, k) => Math.sin((2 * Math.PI * fSignal * k) / fs + 0.4));
      const r = demodulate({ samples, sampleRateHz: fs, referenceHz: fRef });
      expect(r.r, `${fSignal} Hz`).toBeLessThan(2e-3);
    }
  });

  it('a harmonic of the reference is rejected exactly over whole periods', () => {
    const samples = Array.from({ length: 500 }, (_, k) => Math.sin((2 * Math.PI * 2 * k) / 50));
    expect(demodulate({ samples, sampleRateHz: 1000, referenceHz: 20 }).r).toBeLessThan(1e-13);
  });

  it('refuses too few samples and references above Nyquist', () => {
    expect(() => demodulate({ samples: [1, 2, 3], sampleRateHz: 100, referenceHz: 10 })).toThrow(/whole reference period/);
    expect(() => demodulate({ samples: [1, 2, 3], sampleRateHz: 100, referenceHz: 60 })).toThrow(/Nyquist/);
  });
});
