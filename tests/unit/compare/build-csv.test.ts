// The CSV export: long form, units aligned across curves, every source cited by DOI, full resolution.
import { describe, expect, it } from 'vitest';
import { buildCompareCsv, csvNumber } from '@/lib/compare/build-csv';
import { copperFilm, FULL, itoFilm, localFile, rhoOfT } from './fixtures';

const common = { full: FULL, exportedAt: '2026-12-03T09:30:00.000Z', siteUrl: 'http://localhost:3000' };

describe('buildCompareCsv', () => {
  it('writes two curves in µΩ·cm with a header citing both DOIs (exact text)', () => {
    const csv = buildCompareCsv({ ...common, entries: [copperFilm, itoFilm], settings: rhoOfT });
    expect(csv).toBe([
      '# Ohmstead compare export',
      '# Exported: 2026-12-03T09:30:00.000Z from http://localhost:3000',
      '# Layout: one row per measured point; "curve" is the number of a source listed below. Every finite point of each curve is included (no downsampling, no interpolation).',
      "# x: Temperature T in K (UCUM K), converted from each file's own unit through SI.",
      "# y: Resistivity ρ in µΩ·cm (UCUM uOhm.cm), converted from each file's own unit through SI.",
      '# Sources (cite each dataset version you use by its DOI):',
      '# curve 1: Resistivity of a 50 nm copper film from 2 K to 300 K — version 1 — https://doi.org/10.80123/ohm.ab12-cd34 — Larkspur Cryogenic Lab — file LCL-CuF-21_RT_warming.csv — columns T_sample and resistivity (computed by Ohmstead from the file and its sample geometry) — 4 points',
      '# curve 2: Van der Pauw sheet resistance of a 40 nm ITO film, 10–300 K — version 2 — https://doi.org/10.80123/ohm.ef56-gh78 — Tidewater Thin Films Group — file TTF-ITO-040_vdP_warming.csv — columns T and resistivity (computed by Ohmstead from the file and its sample geometry) — 2 points',
      'curve,temperature (K),resistivity (uOhm.cm)',
      // 5.5e-9 Ω·m = 0.55 µΩ·cm (1 µΩ·cm = 1e-8 Ω·m); 4.1e-6 Ω·m = 410 µΩ·cm.
      '1,2,0.55',
      '1,100,0.8',
      '1,200,1.3',
      '1,300,1.75',
      '2,10,410',
      '2,300,400',
      '',
    ].join('\n'));
  });

  it('normalises each curve by its own ρ(300 K) from the full data, and lists a curve that cannot be', () => {
    const settings = { ...rhoOfT, normalisation: { kind: 'at-x', x: 300 } as const };
    const lines = buildCompareCsv({ ...common, entries: [copperFilm, localFile, itoFilm], settings }).trimEnd().split('\n');
    expect(lines[4]).toBe('# y: Resistivity, normalised: ρ/ρ(300 K), a ratio (1); each curve is divided by its own reference value, computed from its full-resolution data.');
    expect(lines).toContain('# Left out: curve 2 (my-sample <B>.csv — your local file (not deposited, no DOI)): Not possible: the curve does not reach 300 K (its T spans 4 K – 250 K).');
    expect(lines.find((l) => l.startsWith('# curve 1:'))).toMatch(/— 4 points — reference 1\.75 uOhm\.cm$/);
    const header = lines.indexOf('curve,temperature (K),resistivity / resistivity at temperature = 300 K (1)');
    expect(header).toBeGreaterThan(0);
    // 5.5e-9 / 1.75e-8 = 0.3142857143; 8e-9 / 1.75e-8 = 0.4571428571; 4.1e-6 / 4.0e-6 = 1.025 (numbers kept under the curve number 3).
    expect(lines.slice(header + 1)).toEqual(['1,2,0.3142857143', '1,100,0.4571428571', '1,200,0.7428571429', '1,300,1', '3,10,1.025', '3,300,1']);
  });

  it('states the Oe convention when a field axis is exported', () => {
    const field = { column: 'B', quantity: 'field', ucum: 'T' };
    const entry = { ...copperFilm, key: 'f', chosen: { x: 'B', y: 'R' }, options: [{ x: field, y: { column: 'R', quantity: 'resistance', ucum: 'Ohm' }, derived: false, sourcePoints: 2, points: [[0, 1], [1, 2]] as [number, number][] }] };
    const csv = buildCompareCsv({
      ...common, entries: [entry], full: new Map([['f', { x: [0, 0.5], y: [1, 1.5] }]]),
      settings: { ...rhoOfT, xKey: 'field|T', yKey: 'resistance|Ohm', xUnit: 'kOe', yUnit: 'Ohm' },
    });
    expect(csv).toContain('# Field: values recorded in Oe were converted on deposit; Oe and T are related by the lab convention 1 Oe ↔ 1e-4 T');
    expect(csv).toContain('curve,field (kOe),resistance (Ohm)\n1,0,1\n1,5,1.5\n'); // 0.5 T ↔ 5 kOe
  });

  it('writes ten significant digits without binary noise', () => {
    expect(csvNumber(0.1 + 0.2)).toBe('0.3');
    expect(csvNumber(1.7262754228680372e-8)).toBe('1.726275423e-8');
    expect(csvNumber(-410)).toBe('-410');
  });
});
