import { describe, expect, it } from 'vitest';
import { BG_FILM, bgFilmResistivity } from '@/db/seeds/demo-data/bloch-gruneisen-film';
import { HALL_SERIES, hallFileName } from '@/db/seeds/demo-data/hall-series';
import { MR_SWEEP } from '@/db/seeds/demo-data/magnetoresistance-sweep';
import { NB_WIRE, nbNormalResistivity } from '@/db/seeds/demo-data/niobium-transition';
import { VDP_FILM, vdpReducedResistance, vdpSheetResistance } from '@/db/seeds/demo-data/van-der-pauw-film';
import { resistanceFromReversal, solveVanDerPauw } from '@/lib/transport/physics';
import { bgRatio } from '../../fixtures/transport/params';
import { analysed, columnValues, derivedValue, relativeError } from './helpers';

// The values summariseFile derives from each demo file must give back the physics the generator put in.

describe('Bloch–Grüneisen copper film', () => {
  it('its model is the Bloch–Grüneisen form (checked with the independent Simpson integral of the fixtures)', () => {
    for (const t of [4.2, 20, 77, 150, 300]) {
      const ideal = (bgFilmResistivity(t) - BG_FILM.residualOhmM) / BG_FILM.idealAt273_15OhmM;
      expect(relativeError(ideal, bgRatio(t, BG_FILM.debyeK))).toBeLessThan(1e-6);
    }
  });

  it('RRR = ρ(273 K)/ρ(4.2 K) and ρ(300 K) from the file match the model', async () => {
    const { summary } = await analysed('LCL-CuF-21_RT_warming.csv');
    // Noise of 4e-5 Ω on R ≈ 1.1–4.7 Ω: a few 1e-5 relative per point; the RRR definition is Splett et al. (2011).
    expect(relativeError(derivedValue(summary, 'rrr'), bgFilmResistivity(273) / bgFilmResistivity(4.2))).toBeLessThan(2e-4);
    expect(relativeError(derivedValue(summary, 'resistivity.at-max-temperature'), bgFilmResistivity(300))).toBeLessThan(2e-4);
    expect(relativeError(derivedValue(summary, 'resistivity.at-min-temperature'), BG_FILM.residualOhmM)).toBeLessThan(2e-4);
    expect(derivedValue(summary, 'rrr')).toBeCloseTo(3.907, 2); // a typical film value, far below bulk copper's
  });
});

describe('niobium wire transition', () => {
  it('the half-point of R(T) on the summary’s preview curve is Tc = 9.25 K', async () => {
    const { summary } = await analysed('LCL-Nb-W03_transition_cooling.csv');
    const preview = summary.previews.find((p) => p.x === 'T' && p.y === 'R');
    const points = [...(preview?.points ?? [])].sort((a, b) => a[0] - b[0]);
    const normal = points.filter(([t]) => t > 9.6 && t < 10).map(([, r]) => r);
    const half = normal.reduce((s, r) => s + r, 0) / normal.length / 2;
    const i = points.findIndex(([, r]) => r >= half);
    const [[t0, r0], [t1, r1]] = [points[i - 1], points[i]];
    const tc = t0 + ((half - r0) * (t1 - t0)) / (r1 - r0);
    expect(Math.abs(tc - NB_WIRE.criticalK)).toBeLessThan(0.01);
  });

  it('the normal-state ρ at 14 K is the model’s, and R is the reversal average with the thermal offset cancelled', async () => {
    const { summary, table } = await analysed('LCL-Nb-W03_transition_cooling.csv');
    expect(relativeError(derivedValue(summary, 'resistivity.at-max-temperature'), nbNormalResistivity(14))).toBeLessThan(5e-3);
    const [vPos, vNeg, r] = [columnValues(table, 'V_pos'), columnValues(table, 'V_neg'), columnValues(table, 'R')];
    let offset = 0;
    for (let i = 0; i < r.length; i++) {
      offset += (vPos[i] + vNeg[i]) / 2;
      // R = (V₊ − V₋)/(2I), the current-reversal average (common practice), to the file's 6 digits.
      expect(Math.abs(r[i] - resistanceFromReversal(vPos[i], vNeg[i], NB_WIRE.currentA))).toBeLessThan(2e-9);
    }
    // The offset drifts from 1.5 µV to 1.7 µV over the run: its mean is 1.6 µV.
    expect(offset / r.length).toBeCloseTo(NB_WIRE.thermoelectricV + 0.1e-6, 8);
  });
});

describe('van der Pauw ITO film', () => {
  it('the generator’s bisection and lib/transport’s Newton solver agree on van der Pauw’s equation', () => {
    const y = vdpReducedResistance(VDP_FILM.ratio);
    expect(Math.exp(-Math.PI * VDP_FILM.ratio * y) + Math.exp(-Math.PI * y)).toBeCloseTo(1, 12);
    expect(solveVanDerPauw(VDP_FILM.ratio * y, y)).toBeCloseTo(1, 12); // R_s = 1 for R_B = y·R_s
    expect(vdpReducedResistance(1)).toBeCloseTo(Math.LN2 / Math.PI, 12); // symmetric case: R_s = πR/ln 2
  });

  it('R_s and ρ = R_s·t at 300 K and 10 K match the model', async () => {
    const { summary } = await analysed('TTF-ITO-040_vdP_warming.csv');
    expect(summary.encoding).toBe('latin1');
    expect(relativeError(derivedValue(summary, 'sheet-resistance.at-max-temperature'), vdpSheetResistance(300))).toBeLessThan(5e-4);
    expect(relativeError(derivedValue(summary, 'sheet-resistance.at-min-temperature'), vdpSheetResistance(10))).toBeLessThan(5e-4);
    expect(relativeError(derivedValue(summary, 'resistivity.at-max-temperature'), VDP_FILM.sheetAt300OhmSq * VDP_FILM.thicknessM)).toBeLessThan(5e-4);
  });
});

describe('GaAs:Si Hall series', () => {
  it.each(HALL_SERIES.points)('$temperatureK K: electron density and Hall mobility from the antisymmetrised slope', async (point) => {
    const { summary } = await analysed(hallFileName(point));
    // n = 1/(e|R_H|), R_H = R_H,s·t (NIST Hall method); the 0.4 % even offset in R_xy must not bias it.
    expect(relativeError(derivedValue(summary, 'hall.density'), point.densityPerCm3)).toBeLessThan(1e-3);
    expect(summary.derived.find((d) => d.key === 'hall.density')?.detail).toEqual({ carrierType: 'electrons' });
    // μ = |R_H|/ρ(B = 0), the Drude mobility the generator used.
    expect(relativeError(derivedValue(summary, 'hall.mobility'), point.mobilityCm2PerVs)).toBeLessThan(2e-3);
  });
});

describe('WTe2 magnetoresistance at ±14 T', () => {
  it('MR(14 T) of the symmetrised curve is (μ_MR·B)², the odd pick-up removed', async () => {
    const { summary } = await analysed('CRM-WT-11_MR_2K_pm14T.tsv');
    const mr = summary.derived.find((d) => d.key === 'magnetoresistance.at-max-field');
    expect(mr?.detail).toMatchObject({ symmetrised: true });
    // R0 carries 4e-4 relative noise (5 nV on 13 µV), so MR is good to about 1e-3.
    expect(relativeError(mr?.value ?? NaN, 100 * (MR_SWEEP.mobilityPerT * MR_SWEEP.maxFieldT) ** 2)).toBeLessThan(2e-3);
    expect(relativeError(derivedValue(summary, 'resistivity.at-zero-field'), MR_SWEEP.residualOhmM)).toBeLessThan(2e-3);
  });
});
