import { execFile } from 'node:child_process';
import { createReadStream, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { PARALLEL_MIN_BYTES } from '@/lib/transport/parse/parallel-rows';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { FileSummary } from '@/lib/transport/summary';
import { seededRandom } from './physics/seeded-random';
import { CU_WIRE, ELEMENTARY_CHARGE_C, FILM, HALL_BAR, cuAreaM2, cuResistivity, hallRxx } from '../../fixtures/transport/params';

// Runs the analyze CLI (scripts/analyze.ts through tsx, as `npx tsx` would) as a child process on every fixture.
const ROOT = path.resolve(import.meta.dirname, '../../..');
const FIXTURES = path.join(ROOT, 'tests/fixtures/transport');
const TSX_CLI = path.join(ROOT, 'node_modules/tsx/dist/cli.mjs');

type Run = { code: number; stdout: string; stderr: string };

function analyze(args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(process.execPath, [TSX_CLI, 'scripts/analyze.ts', ...args], { cwd: ROOT, maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : -1) : 0, stdout, stderr });
    });
  });
}

const fixture = (name: string) => path.join(FIXTURES, name);
const rel = (actual: number | undefined, expected: number) => Math.abs((actual ?? NaN) - expected) / Math.abs(expected);
/** A derived value; the summary quotes 7 significant digits, so relative agreement to 5e-7 is exact. */
const derived = (s: FileSummary, key: string) => s.derived.find((d) => d.key === key)?.value;
const columns = (s: FileSummary) => s.columns.map((c) => [c.name, c.quantity, c.ucum, c.siUcum, c.role]);

/** What each fixture must give: a summary check, or exit 2 with the error line on stderr. */
const EXPECTED: Record<string, { meta?: string; check: (s: FileSummary) => void } | { stderr: string }> = {
  'cu-wire-rt.csv': {
    meta: 'cu-wire-rt.meta.json',
    check: (s) => {
      expect(s.rowCount).toBe(CU_WIRE.temperaturesK.length);
      expect(columns(s)).toEqual([['T', 'temperature', 'K', 'K', 'x'], ['R', 'resistance', 'mOhm', 'Ohm', 'y'], ['I', 'current', 'mA', 'A', 'aux']]);
      expect(s.geometry).toMatchObject({ lengthM: CU_WIRE.lengthM, areaM2: cuAreaM2(), areaFrom: 'diameter' });
      // R was written as ρ(T)·L/A (params.ts), so ρ = R·A/L gives the generating ρ back, to the summary's 7 digits.
      expect(rel(derived(s, 'resistivity.at-max-temperature'), cuResistivity(300))).toBeLessThan(5e-7);
      expect(rel(derived(s, 'resistivity.at-min-temperature'), cuResistivity(2))).toBeLessThan(5e-7);
      expect(rel(derived(s, 'rrr'), cuResistivity(273) / cuResistivity(4.2))).toBeLessThan(5e-7);
    },
  },
  'tidewater-film-rs.csv': {
    meta: 'tidewater-film-rs.meta.json',
    check: (s) => {
      expect(s).toMatchObject({ rowCount: FILM.temperaturesK.length, delimiter: ';', decimalSeparator: ',' });
      expect(columns(s)).toEqual([['T', 'temperature', 'K', 'K', 'x'], ['Rs', 'sheet-resistance', 'Ohm/{sq}', 'Ohm/{sq}', 'y'], ['I', 'current', 'uA', 'A', 'aux']]);
      const rs = (t: number) => FILM.aOhmSq + FILM.bOhmSqPerK * t; // params.ts: R_s = a + b·T
      expect(rel(derived(s, 'resistivity.at-max-temperature'), rs(300) * FILM.thicknessM)).toBeLessThan(1e-12); // ρ = R_s·t = 2.5e-7 Ω·m
      expect(rel(derived(s, 'rrr'), rs(273) / rs(4.2))).toBeLessThan(5e-7);
    },
  },
  'cobalt-ridge-hallbar.dat': {
    meta: 'cobalt-ridge-hallbar.meta.json',
    check: (s) => {
      expect(s).toMatchObject({ rowCount: HALL_BAR.fieldsOe.length, delimiter: 'whitespace', sweep: { variable: 'field', from: 'metadata' } });
      expect(columns(s)).toEqual([
        ['Field', 'field', 'Oe', 'T', 'x'],
        ['Rxx', 'resistance', 'Ohm', 'Ohm', 'y'],
        ['Rxy', 'hall-resistance', 'Ohm', 'Ohm', 'y'],
        ['T', 'temperature', 'K', 'K', 'aux'],
      ]);
      // n_s = 1/(e·R_H,s) with the generating density; R_s(0) = R_xx(0)·w/L; MR(9 T) = β·B² (params.ts).
      expect(rel(derived(s, 'hall.sheet-density'), HALL_BAR.sheetDensityPerM2 * 1e-4)).toBeLessThan(5e-7);
      expect(rel(derived(s, 'sheet-resistance.at-zero-field'), (hallRxx(0) * HALL_BAR.widthM) / HALL_BAR.lengthM)).toBeLessThan(5e-7);
      expect(derived(s, 'magnetoresistance.at-max-field')).toBeCloseTo(HALL_BAR.mrCoefficientPerT2 * 81 * 100, 4);
      const mobility = 1 / (ELEMENTARY_CHARGE_C * HALL_BAR.sheetDensityPerM2 * HALL_BAR.sheetResistanceOhmSq); // μ = 1/(e n_s R_s)
      expect(rel(derived(s, 'hall.mobility'), mobility * 1e4)).toBeLessThan(5e-7);
    },
  },
  'latin1-cuni-rho.csv': {
    check: (s) => {
      expect(s).toMatchObject({ rowCount: 30, encoding: 'latin1' });
      expect(columns(s)).toEqual([['Temp', 'temperature', 'K', 'K', 'x'], ['rho', 'resistivity', 'uOhm.cm', 'Ohm.m', 'y'], ['Tset', 'temperature', 'Cel', 'K', 'aux']]);
      // make-fixtures.ts writes ρ = 48.9 + 0.001·T µΩ·cm (1 µΩ·cm = 1e-8 Ω·m) and Tset = T − 273.15 °C.
      expect(rel(derived(s, 'resistivity.at-max-temperature'), (48.9 + 0.3) * 1e-8)).toBeLessThan(1e-12);
      expect(s.columns[2].range?.min).toBeCloseTo(10, 9);
    },
  },
  'utf16-lockin.tsv': {
    check: (s) => {
      expect(s).toMatchObject({ rowCount: 20, encoding: 'utf-16le', delimiter: '\t' });
      expect(columns(s).map((c) => c.slice(0, 4))).toEqual([
        ['Time', 'time', 's', 's'],
        ['X', 'lock-in-x', 'uV', 'V'],
        ['Y', 'lock-in-y', 'uV', 'V'],
        ['R', 'lock-in-r', 'uV', 'V'],
        ['Theta', 'lock-in-phase', 'deg', 'rad'],
      ]);
      expect(s.columns[1].range?.max).toBeCloseTo(10e-6 * Math.cos(Math.PI / 6), 15); // X = R cos θ, R = 10 µV, θ = 30°
    },
  },
  'duplicate-headers-nan.csv': {
    check: (s) => {
      expect(s.rowCount).toBe(4);
      expect(s.columns.map((c) => [c.name, c.nanCount])).toEqual([['T', 0], ['R', 2], ['R_2', 1], ['V', 2]]);
      expect(s.warnings.map((w) => [w.line, w.code])).toEqual([[1, 'duplicate-header']]);
    },
  },
  'sectioned-export.csv': {
    check: (s) => {
      expect(s).toMatchObject({ rowCount: 30, headerMetadata: { Operator: 'Imogen Vale' }, sweep: { variable: 'temperature', from: 'data' } });
      expect(columns(s).map((c) => c.slice(0, 2))).toEqual([['Time Stamp', 'time'], ['Temperature', 'temperature'], ['Field', 'field'], ['Resistance', 'resistance']]);
      expect(s.columns[3].range).toEqual({ min: 0.25, max: 0.54 }); // 0.25 + 0.01·i, i = 0…29
    },
  },
  'inconsistent-columns.csv': {
    check: (s) => {
      expect(s.rowCount).toBe(3);
      expect(s.warnings.map((w) => [w.line, w.code])).toEqual([[3, 'short-row'], [4, 'long-row']]);
    },
  },
  'empty.csv': { stderr: 'analyze: empty (line 1): The file is empty: line 1 has no bytes at all.\n' },
  'header-only.csv': { stderr: 'analyze: no-data (line 1): The file has a header (line 1) but no rows of numbers.\n' },
  'larkspur-raw-log.bin': {
    stderr: 'analyze: binary (line 1): This is not a text table: line 1 contains a NUL byte (byte 7; a binary file?). Export the data as CSV, TSV or plain text.\n',
  },
};

const runs = new Map<string, Run>();

beforeAll(async () => {
  const names = Object.keys(EXPECTED);
  // Two at a time: each run starts Node and tsx (about a second).
  for (let i = 0; i < names.length; i += 2) {
    await Promise.all(
      names.slice(i, i + 2).map(async (name) => {
        const e = EXPECTED[name];
        runs.set(name, await analyze([fixture(name), ...('meta' in e && e.meta ? ['--meta', fixture(e.meta)] : [])]));
      }),
    );
  }
}, 180_000);

describe('npm run analyze on every fixture', () => {
  it('has an expectation for every data file in tests/fixtures/transport', () => {
    const data = readdirSync(FIXTURES).filter((f) => !f.endsWith('.ts') && !f.endsWith('.meta.json'));
    expect(data.sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  for (const [name, e] of Object.entries(EXPECTED)) {
    if ('check' in e) {
      it(`${name}: exit 0 and the expected summary`, () => {
        const run = runs.get(name) as Run;
        expect({ code: run.code, stderr: run.stderr }).toEqual({ code: 0, stderr: '' });
        const summary = JSON.parse(run.stdout) as FileSummary;
        expect(summary.fileName).toBe(name);
        e.check(summary);
      });
    } else {
      it(`${name}: exit 2 with a message naming the line`, () => {
        expect(runs.get(name)).toEqual({ code: 2, stdout: '', stderr: e.stderr });
      });
    }
  }

  it('a missing file and unreadable metadata are usage errors (exit 2)', async () => {
    expect(await analyze([fixture('no-such-file.csv')])).toMatchObject({ code: 2, stderr: `analyze: ${fixture('no-such-file.csv')}: no such file\n` });
    const run = await analyze([fixture('cu-wire-rt.csv'), '--meta', fixture('cu-wire-rt.csv')]);
    expect(run).toMatchObject({ code: 2, stdout: '' });
    expect(run.stderr).toMatch(/^analyze: metadata .*cu-wire-rt\.csv: not valid JSON/);
  }, 60_000);
});

describe('npm run analyze on a file large enough to be read on worker threads', () => {
  it('gives, under node --conditions=react-server --import tsx (as the deposit worker runs), the sequential summary', async () => {
    // An invented Cobalt Ridge field loop: R = 125 Ω·(1 + 0.004·B²) with noise, 250 000 rows (over 9 MiB).
    const random = seededRandom(20261203);
    const lines = ['# Cobalt Ridge Magnetotransport Lab - field loop (invented test data)', 't (s),T (K),B (T),R (Ohm)'];
    for (let i = 0; i < 250_000; i++) {
      const b = 9 * Math.sin((2 * Math.PI * i) / 125_000);
      lines.push(`${(i * 0.05).toFixed(2)},${(2 + 0.001 * random()).toFixed(5)},${b.toFixed(6)},${(125 * (1 + 0.004 * b * b) + 0.002 * random()).toFixed(6)}`);
    }
    const dir = mkdtempSync(path.join(tmpdir(), 'ohmstead-analyze-'));
    const file = path.join(dir, 'cobalt-ridge-field-loop.csv');
    try {
      writeFileSync(file, lines.join('\n') + '\n');
      expect(statSync(file).size).toBeGreaterThan(PARALLEL_MIN_BYTES);
      const run = await new Promise<Run>((resolve) => {
        const args = ['--conditions=react-server', '--import', 'tsx', 'scripts/analyze.ts', file];
        execFile(process.execPath, args, { cwd: ROOT, maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
          resolve({ code: error ? (typeof error.code === 'number' ? error.code : -1) : 0, stdout, stderr });
        });
      });
      expect({ code: run.code, stderr: run.stderr }).toEqual({ code: 0, stderr: '' });
      const sequential = await summariseFile(createReadStream(file), { fileName: path.basename(file), sizeBytes: statSync(file).size, parallel: false });
      expect(JSON.parse(run.stdout)).toEqual(JSON.parse(JSON.stringify(sequential)));
      expect(sequential.rowCount).toBe(250_000);
      // R(9 T) = R0·(1 + β·B²): MR = β·B² = 32.4 % at the top of the loop (the definition; bin-averaged, so a little under).
      expect(derived(sequential, 'magnetoresistance.at-max-field')).toBeCloseTo(32.4, 0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
