import { readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { applyColumnChange, effectiveColumn, recordColumns } from '@/components/deposit/columns/column-overrides';
import { unitCatalogue } from '@/components/deposit/columns/unit-catalogue';
import { convertWith, groupedUnits } from '@/components/deposit/columns/unit-choice';
import { previewView } from '@/components/deposit/preview/preview-view';
import { headBytes, previewLocalFile } from '@/components/deposit/preview/local-preview';
import { alignCurve, describeCurve } from '@/components/plot/plot-data';
import { bytesFromBuffer } from '@/lib/transport/parse';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { FileSummary } from '@/lib/transport/summary/types';

const FIXTURES = path.resolve(import.meta.dirname, '../../fixtures/transport');
// The Cu-wire fixture with its resistance header in capitals: 'MOHM' reads as mega-ohm, the classic wrong guess.
const capsCsv = () => readFileSync(path.join(FIXTURES, 'cu-wire-rt.csv'), 'utf8').replace('R [mOhm]', 'R (MOHM)');
const catalogue = unitCatalogue();
let caps: FileSummary;

beforeAll(async () => {
  caps = await summariseFile(bytesFromBuffer(capsCsv()), { fileName: 'cu-caps.csv' });
});

describe('unit catalogue for the browser', () => {
  it('carries SI factors from lib/transport/units, field-strength units by the 1 Oe ↔ 1e-4 T convention', () => {
    const find = (u: string) => catalogue.find((c) => c.ucum === u)!;
    expect(find('mOhm')).toMatchObject({ siUcum: 'Ohm', factor: 1e-3, dimension: 'resistance', label: 'mΩ' });
    expect(find('MOhm').factor).toBe(1e6);
    expect(find('Oe')).toMatchObject({ siUcum: 'T', factor: 1e-4, dimension: 'magneticFluxDensity' });
    expect(find('Cel')).toMatchObject({ siUcum: 'K', factor: 1, offset: 273.15 });
    expect(convertWith(catalogue, 1, 'MOhm', 'mOhm')).toBe(1e9);
    expect(convertWith(catalogue, 1, 'K', 'mOhm')).toBeUndefined();
    expect(groupedUnits(catalogue, 'mOhm')[0].dimension).toBe('resistance');
  });
});

describe('column mapping', () => {
  it('the detector reads MOHM as mega-ohm and says it may mean milli', () => {
    const r = caps.columns.find((c) => c.name === 'R')!;
    expect(r.ucum).toBe('MOhm');
    expect(caps.warnings.find((w) => w.column === 'R')?.code).toBe('unit-ambiguous');
  });

  it('writes the whole file mapping to record.columns when one unit is fixed, keeping other files’ entries', () => {
    const record = { title: 't', columns: [{ name: 'B', quantity: 'field', unit: 'T', role: 'x' }] };
    const columns = applyColumnChange(record, caps.columns, 'R', { unit: 'mOhm' });
    expect(columns).toEqual([
      { name: 'B', quantity: 'field', unit: 'T', role: 'x' },
      { name: 'T', quantity: 'temperature', unit: 'K', role: 'x' },
      { name: 'R', quantity: 'resistance', unit: 'mOhm', role: 'y' },
      { name: 'I', quantity: 'current', unit: 'mA', role: 'aux' },
    ]);
    const eff = effectiveColumn(caps.columns[1], recordColumns({ columns }));
    expect(eff).toEqual({ quantity: 'resistance', unit: 'mOhm', role: 'y', fromRecord: true });
  });

  it('a new x column demotes the old one to aux', () => {
    const columns = applyColumnChange({}, caps.columns, 'I', { role: 'x' }) as { name: string; role: string }[];
    expect(columns.map((c) => [c.name, c.role])).toEqual([['T', 'aux'], ['R', 'y'], ['I', 'x']]);
  });
});

describe('preview redraws at once when a unit is fixed', () => {
  it('rescales the analysed R(T) from MΩ to mΩ and labels the axes with units', () => {
    const rOfT = caps.previews.find((p) => p.y === 'R')!;
    const before = previewView(rOfT, caps, {}, catalogue);
    expect(before.yUnit).toBe('MΩ');
    expect(before.points[0]).toEqual([300, expect.closeTo(43.959, 3)]);
    const fixed = { columns: applyColumnChange({}, caps.columns, 'R', { unit: 'mOhm' }) };
    const after = previewView(rOfT, caps, fixed, catalogue);
    // 43.95924267 in the file is 43.96 mΩ once read as milli-ohm (first row of cu-wire-rt.csv).
    expect(after.yUnit).toBe('mΩ');
    expect(after.xUnit).toBe('K');
    expect(after.points[0][0]).toBe(300);
    expect(after.points[0][1]).toBeCloseTo(43.95924267, 6);
    expect(after.stale).toBe(false);
  });

  it('marks the curve as waiting for analysis when the quantity changes', () => {
    const rOfT = caps.previews.find((p) => p.y === 'R')!;
    const changed = { columns: applyColumnChange({}, caps.columns, 'R', { quantity: 'voltage' }) };
    expect(previewView(rOfT, caps, changed, catalogue).stale).toBe(true);
  });
});

describe('plot data', () => {
  it('sorts a cooling sweep for uPlot and keeps the line; a sweep that turns back is drawn as points', () => {
    const cooling = alignCurve([[300, 3], [200, 2], [2, 1]]);
    expect(cooling).toEqual({ data: [[2, 200, 300], [1, 2, 3]], hidden: 0, connected: true });
    expect(alignCurve([[0, 1], [1, 2], [0.5, 3]]).connected).toBe(false);
    expect(alignCurve([[0, 1], [1, 2], [2, 0]], { logY: true })).toMatchObject({ hidden: 1 });
  });

  it('describes a curve in words with its ranges, units and trend', () => {
    const text = describeCurve([[300, 43.96], [150, 18.05], [2, 0.2546]], { xName: 'T', yName: 'R', xUnit: 'K', yUnit: 'mΩ' }, 161);
    expect(text).toBe('R against T: 161 points (3 shown); T from 2 to 300 K; R from 0.255 to 44 mΩ; R rises with T.');
  });
});

describe('instant preview of a local file', () => {
  it('cuts at the last line break so no half row is parsed', () => {
    const bytes = new TextEncoder().encode('T,R\n1,2\n3,4');
    expect(new TextDecoder().decode(headBytes(bytes, 10, false))).toBe('T,R\n1,2\n');
    expect(headBytes(bytes, 100, true)).toBe(bytes);
  });

  it('summarises the first 256 KiB in the same core as the worker, with the draft mapping', async () => {
    const file = new File([capsCsv()], 'cu-caps.csv', { type: 'text/csv' });
    const metadata = { columns: [{ name: 'R', quantity: 'resistance' as const, unit: 'mOhm', role: 'y' as const }] };
    const result = await previewLocalFile(file, metadata);
    if (!result.ok) throw new Error(result.message);
    expect(result.wholeFile).toBe(true);
    expect(result.summary.rowCount).toBe(161);
    expect(result.summary.columns[1].ucum).toBe('mOhm');
    expect(result.summary.columns[1].range?.max).toBeCloseTo(0.04395924267, 12);
  });

  it('explains a file that is not a table', async () => {
    const result = await previewLocalFile(new File([new Uint8Array([0, 1, 2, 0, 5, 0])], 'scope.bin'), undefined);
    expect(result).toEqual({ ok: false, message: expect.stringContaining('not a text table') });
  });
});
