import { describe, expect, it } from 'vitest';
import { CU_WIRE, ELEMENTARY_CHARGE_C, FILM, HALL_BAR, bgRatio, cuResistivity } from '../../../fixtures/transport/params';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import { closeTo, derivedValue, meta, summariseFixture } from './helpers';

describe('the fixtures’ generating model (params.ts) is right', () => {
  it('reproduces the Bloch–Grüneisen ratios of domain.md for Θ = 343.5 K', () => {
    // domain.md check values, Bloch (1930), Grüneisen (1933): ρ_i(T)/ρ_i(273.15 K).
    expect(bgRatio(4.2, 343.5)).toBeCloseTo(1.865134e-7, 12);
    expect(bgRatio(77, 343.5)).toBeCloseTo(0.1205364, 7);
    expect(bgRatio(300, 343.5)).toBeCloseTo(1.114465, 6);
  });
});

describe('summariseFile: Cu wire R(T) with metadata', () => {
  it('maps columns and roles and computes ρ = R·A/L at both ends', async () => {
    const s = await summariseFixture('cu-wire-rt.csv', meta('cu-wire-rt.meta.json'));
    expect(s.summaryVersion).toBe('1.0.0');
    expect(s.columns.map((c) => [c.name, c.quantity, c.role])).toEqual([['T', 'temperature', 'x'], ['R', 'resistance', 'y'], ['I', 'current', 'aux']]);
    expect(s.sweep).toEqual({ variable: 'temperature', from: 'metadata' });
    expect(s.geometry).toMatchObject({ lengthM: 0.02, areaFrom: 'diameter' });
    // The file holds R = ρ(T)·L/A, so ρ recovered from R·A/L must equal the generating ρ(T) (to the file's 10 digits).
    expect(closeTo(derivedValue(s, 'resistivity.at-max-temperature'), cuResistivity(300), 1e-6)).toBe(true);
    expect(closeTo(derivedValue(s, 'resistivity.at-min-temperature'), cuResistivity(2), 1e-6)).toBe(true);
    // ρ(300 K) = ρ0 + ρi(273.15 K)·1.114465 with the domain.md Bloch–Grüneisen ratio.
    expect(closeTo(derivedValue(s, 'resistivity.at-max-temperature'), CU_WIRE.residualOhmM + CU_WIRE.idealAt273_15OhmM * 1.114465, 1e-6)).toBe(true);
  });

  it('computes RRR = ρ(273 K)/ρ(4.2 K) from the curve', async () => {
    const s = await summariseFixture('cu-wire-rt.csv', meta('cu-wire-rt.meta.json'));
    const rrr = s.derived.find((d) => d.key === 'rrr');
    // RRR definition (Splett et al., J. Res. NIST 116, 489 (2011)); both references are grid points of the file.
    const expected = cuResistivity(273) / cuResistivity(4.2);
    expect(rrr?.detail).toMatchObject({ highK: 273, lowK: 4.2, highExtrapolated: false, lowHeld: false, from: 'resistivity' });
    expect(closeTo(rrr?.value ?? 0, expected, 1e-6)).toBe(true);
    expect(expected).toBeGreaterThan(150);
  });

  it('names the temperature actually used when the curve stops above 4.2 K', async () => {
    // The same Cu wire ρ(T) model, sampled from 10 K only: ρ(4.2 K) is not in the data, so the lowest point stands in.
    const temperatures = Array.from({ length: 30 }, (_, i) => 10 + i * 10);
    const csv = `T (K),rho (Ohm.m)\n${temperatures.map((t) => `${t},${cuResistivity(t).toPrecision(10)}`).join('\n')}\n`;
    const s = await summariseFile(bytesFromBuffer(Buffer.from(csv)), { fileName: 'from-10K.csv' });
    const rrr = s.derived.find((d) => d.key === 'rrr');
    expect(rrr?.label).toBe('RRR = ρ(273 K)/ρ(10 K)');
    expect(rrr?.method).toContain('does not reach 4.2 K, so its lowest point (10 K) stands in');
    expect(rrr?.detail).toMatchObject({ lowK: 4.2, lowUsedK: 10, lowHeld: true });
    // 273 K falls between the 270 K and 280 K points: the ratio uses the linear interpolation between them.
    const at273 = cuResistivity(270) + 0.3 * (cuResistivity(280) - cuResistivity(270));
    expect(closeTo(rrr?.value ?? 0, at273 / cuResistivity(10), 1e-6)).toBe(true);
  });

  it('builds the quality context from metadata: a 4-pole 300 ms lock-in at 1 K/min lags the sweep', async () => {
    const s = await summariseFixture('cu-wire-rt.csv', meta('cu-wire-rt.meta.json'));
    expect(s.quality.map((q) => q.code)).toEqual(['lock-in-sweep-lag']);
    expect(s.quality.some((q) => q.code === 'missing-geometry')).toBe(false);
  });

  it('without metadata: no resistivity, a missing-geometry flag, RRR from R', async () => {
    const s = await summariseFixture('cu-wire-rt.csv');
    expect(s.geometry).toBeNull();
    expect(s.notComputed.map((n) => n.key)).toEqual(['resistivity']);
    expect(s.quality.map((q) => q.code)).toContain('missing-geometry');
    expect(closeTo(derivedValue(s, 'rrr'), cuResistivity(273) / cuResistivity(4.2), 1e-6)).toBe(true);
  });

  it('gives ≤ 500-point previews of every y column and derived curve, in SI', async () => {
    const s = await summariseFixture('cu-wire-rt.csv', meta('cu-wire-rt.meta.json'));
    expect(s.previews.map((p) => [p.x, p.y, p.xUcum, p.yUcum, p.derived])).toEqual([
      ['T', 'R', 'K', 'Ohm', false],
      ['T', 'resistivity', 'K', 'Ohm.m', true],
    ]);
    expect(s.previews[0].points).toHaveLength(CU_WIRE.temperaturesK.length);
    expect(s.previews[0].points[0][0]).toBe(300);
    expect(JSON.parse(JSON.stringify(s))).toEqual(s); // plain JSON, no typed arrays
  });
});

describe('summariseFile: thin film R_s(T)', () => {
  it('ρ = R_s·t and RRR of the linear model', async () => {
    const s = await summariseFixture('tidewater-film-rs.csv', meta('tidewater-film-rs.meta.json'));
    const rs = (t: number) => FILM.aOhmSq + FILM.bOhmSqPerK * t;
    expect(derivedValue(s, 'sheet-resistance.at-max-temperature')).toBe(2.5);
    expect(closeTo(derivedValue(s, 'resistivity.at-max-temperature'), rs(300) * FILM.thicknessM, 1e-9)).toBe(true); // ρ = R_s·t = 2.5e-7 Ω·m
    expect(closeTo(derivedValue(s, 'rrr'), rs(273) / rs(4.2), 1e-6)).toBe(true);
    expect(s.quality).toEqual([]);
  });
});

describe('summariseFile: Hall bar field sweep', () => {
  it('MR of the symmetrised R_xx, Hall density and mobility match the domain.md check values', async () => {
    const s = await summariseFixture('cobalt-ridge-hallbar.dat', meta('cobalt-ridge-hallbar.meta.json'));
    expect(s.sweep).toEqual({ variable: 'field', from: 'metadata' });
    // MR = [R(B) − R(0)]/R(0) = β·B² at 9 T, the odd admixture removed by symmetrisation (Onsager).
    expect(derivedValue(s, 'magnetoresistance.at-max-field')).toBeCloseTo(HALL_BAR.mrCoefficientPerT2 * 81 * 100, 4);
    // R_s(0) = R_xx(0)·w/L = 45.323601 Ω/sq (domain.md, van der Pauw R_A = R_B = 10 Ω).
    expect(derivedValue(s, 'sheet-resistance.at-zero-field')).toBeCloseTo(45.323601, 5);
    // R_H,s = 1/(e n_s); the even offset in R_xy removed by antisymmetrisation.
    expect(derivedValue(s, 'hall.sheet-coefficient')).toBeCloseTo(1 / (ELEMENTARY_CHARGE_C * HALL_BAR.sheetDensityPerM2), 4);
    // domain.md Hall check: n_s = 3.120755e12 cm⁻²; with t = 100 nm, R_H = 2.000e-5 m³/C = 20 cm³/C, n = 3.120755e17 cm⁻³.
    expect(closeTo(derivedValue(s, 'hall.sheet-density'), 3.120755e12, 1e-6)).toBe(true);
    expect(derivedValue(s, 'hall.coefficient')).toBeCloseTo(20, 5);
    expect(closeTo(derivedValue(s, 'hall.density'), 3.120755e17, 1e-6)).toBe(true);
    // domain.md: μ = 1/(e n_s R_s) = 44 127.12 cm²/(V·s).
    expect(derivedValue(s, 'hall.mobility')).toBeCloseTo(44127.12, 1);
    expect(s.derived.find((d) => d.key === 'hall.sheet-density')?.detail).toEqual({ carrierType: 'holes' });
  });
});

describe('summariseTable via the other fixtures', () => {
  it('Latin-1 resistivity file: ρ column used directly, no geometry needed', async () => {
    const s = await summariseFixture('latin1-cuni-rho.csv');
    expect(s.columns.find((c) => c.name === 'rho')).toMatchObject({ role: 'y', siUcum: 'Ohm.m' });
    expect(derivedValue(s, 'resistivity.at-max-temperature')).toBeCloseTo(4.92e-7, 13); // 48.9 + 0.001·300 µΩ·cm
    expect(s.quality.some((q) => q.code === 'missing-geometry')).toBe(false);
  });

  it('sectioned export: header metadata kept, time column aux, temperature the swept variable', async () => {
    const s = await summariseFixture('sectioned-export.csv');
    expect(s.headerMetadata.Operator).toBe('Imogen Vale');
    expect(s.sweep).toEqual({ variable: 'temperature', from: 'data' });
    expect(s.columns.map((c) => c.role)).toEqual(['aux', 'x', 'aux', 'y']);
  });

  it('metadata columns override the detected mapping', async () => {
    const s = await summariseFixture('duplicate-headers-nan.csv', {
      columns: [{ name: 'R_2', quantity: 'hall-resistance', unit: 'kOhm', role: 'aux' }],
    });
    const r2 = s.columns.find((c) => c.name === 'R_2');
    expect(r2).toMatchObject({ quantity: 'hall-resistance', ucum: 'kOhm', role: 'aux', confidence: 1, range: { min: 1600, max: 1800 } });
    expect(s.warnings.map((w) => w.code)).toEqual(['duplicate-header', 'column-override']);
  });
});

describe('summariseFile: an x column that barely changes', () => {
  it('reports the point-to-point scatter as not computed instead of failing (the estimator needs distinct neighbours)', async () => {
    // A held temperature: every reading at 4.2 K but the last, so one interior point only has neighbours at distinct T.
    const rows = ['T (K),R (Ohm)', ...Array.from({ length: 40 }, (_, i) => `${i === 39 ? 4.3 : 4.2},${(1 + i * 1e-4).toFixed(6)}`)];
    async function* source() {
      yield new TextEncoder().encode(rows.join('\n') + '\n');
    }
    const { summariseFile } = await import('@/lib/transport/summarise-file');
    const s = await summariseFile(source());
    expect(s.rowCount).toBe(40);
    expect(s.notComputed.map((n) => n.key)).toContain('noise.scatter.R');
    expect(s.derived.some((d) => d.key === 'noise.scatter.R')).toBe(false);
  });
});
