import { describe, expect, it } from 'vitest';
import {
  enbwBoxcar, enbwRcCascade, integrate, johnsonNoiseDensity, johnsonNoisePsd, johnsonNoiseVoltage, jouleHeatingFromVoltageW,
  jouleHeatingW, rcCascadeSettlingTime, rcCascadeStepResponse,
} from '@/lib/transport/physics';

// Γ by numerical integration, independent of the closed form used in enbwRcCascade: Γ(z) = ∫₀^∞ t^(z−1) e^(−t) dt,
// with t = u² to remove the t^(−1/2) singularity at half-integers: Γ(z) = 2∫₀^∞ u^(2z−1) e^(−u²) du.
const gamma = (z: number) => 2 * integrate((u) => u ** (2 * z - 1) * Math.exp(-u * u), 0, 40, 0.25);

describe('equivalent noise bandwidth', () => {
  it('n RC stages: 1/(4τ), 1/(8τ), 3/(32τ), 5/(64τ) (standard result, Γ(n−½)/(4√π Γ(n) τ))', () => {
    const tau = 0.3;
    expect(enbwRcCascade(1, tau)).toBeCloseTo(1 / (4 * tau), 14);
    expect(enbwRcCascade(2, tau)).toBeCloseTo(1 / (8 * tau), 14);
    expect(enbwRcCascade(3, tau)).toBeCloseTo(3 / (32 * tau), 14);
    expect(enbwRcCascade(4, tau)).toBeCloseTo(5 / (64 * tau), 14);
  });

  it('matches Γ(n−½)/(4√π Γ(n) τ) for n = 1…8 with Γ computed numerically', () => {
    for (let n = 1; n <= 8; n++) {
      const expected = gamma(n - 0.5) / (4 * Math.sqrt(Math.PI) * gamma(n) * 1);
      expect(enbwRcCascade(n, 1) / expected, `n = ${n}`).toBeCloseTo(1, 10);
    }
  });

  it('matches the definition ∫₀^∞ |H(f)|² df of an n-pole RC filter', () => {
    for (const n of [1, 2, 5]) {
      const h2 = (f: number) => (1 + (2 * Math.PI * f * 0.1) ** 2) ** -n;
      // f = tan(φ) substitution maps [0, ∞) onto [0, π/2)
      const numeric = integrate((p) => h2(Math.tan(p)) / Math.cos(p) ** 2, 0, Math.PI / 2 - 1e-12, 0.01);
      expect(enbwRcCascade(n, 0.1) / numeric).toBeCloseTo(1, 6);
    }
  });

  it('boxcar over T: 1/(2T) (standard result)', () => {
    expect(enbwBoxcar(0.5)).toBe(1);
    expect(enbwBoxcar(10 / 17.77)).toBeCloseTo(0.8885, 12);
  });

  it('settling to 99 %: 4.61τ, 6.64τ, 8.41τ, 10.05τ for 1–4 poles (Erlang step response; 1 pole: ln 100)', () => {
    expect(rcCascadeSettlingTime(1, 1)).toBeCloseTo(Math.log(100), 10);
    expect(rcCascadeSettlingTime(2, 1)).toBeCloseTo(6.638352, 5);
    expect(rcCascadeSettlingTime(3, 1)).toBeCloseTo(8.405947, 5);
    expect(rcCascadeSettlingTime(4, 1)).toBeCloseTo(10.045118, 5);
    expect(rcCascadeStepResponse(2, 1, rcCascadeSettlingTime(2, 1))).toBeCloseTo(0.99, 12);
    expect(rcCascadeSettlingTime(1, 3e-3, 0.001)).toBeCloseTo(3e-3 * Math.log(1000), 12);
  });
});

describe('Johnson–Nyquist noise (Johnson and Nyquist, Phys. Rev. 32 (1928))', () => {
  it('1 kΩ at 300 K: 4.070355 nV/√Hz; 12.87159 nV over 10 Hz', () => {
    expect(johnsonNoiseDensity(300, 1e3) * 1e9).toBeCloseTo(4.070355, 6);
    expect(johnsonNoiseVoltage(300, 1e3, 10) * 1e9).toBeCloseTo(12.87159, 5);
    expect(johnsonNoisePsd(300, 1e3)).toBeCloseTo(4 * 1.380649e-23 * 300 * 1e3, 30);
  });

  it('1 kΩ at 4.2 K: 0.481611 nV/√Hz', () => {
    expect(johnsonNoiseDensity(4.2, 1e3) * 1e9).toBeCloseTo(0.481611, 6);
  });
});

describe('Joule heating', () => {
  it('P = I²R: 10 µA through 1 kΩ is 100 nW; 1 mV across 1 kΩ is 1 nW (Joule\'s law)', () => {
    expect(jouleHeatingW(10e-6, 1e3)).toBeCloseTo(1e-7, 20);
    expect(jouleHeatingW(-10e-6, 1e3)).toBeCloseTo(1e-7, 20);
    expect(jouleHeatingFromVoltageW(1e-3, 1e3)).toBeCloseTo(1e-9, 22);
  });
});
