// Two invented published curves (Larkspur and Tidewater, ρ(T)) and a local file, as the compare view receives them.
import type { OverlaySettings } from '@/lib/compare/prepare-overlay';
import type { CompareEntry, CurveOption } from '@/lib/compare/types';

const T = (column: string) => ({ column, quantity: 'temperature', ucum: 'K' });
const rho = { column: 'resistivity', quantity: 'resistivity', ucum: 'Ohm.m' };

const option = (x: string, y: CurveOption['y'], points: [number, number][], derived = false, sourcePoints = points.length): CurveOption =>
  ({ x: T(x), y, derived, sourcePoints, points });

export const copperFilm: CompareEntry = {
  key: 'item-1',
  ref: { versionId: '11111111-1111-4111-8111-111111111111', fileId: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa', x: 'T_sample', y: 'resistivity' },
  source: {
    datasetId: 'dddddddd-dddd-4ddd-8ddd-dddddddddddd', versionId: '11111111-1111-4111-8111-111111111111', versionNumber: 1,
    title: 'Resistivity of a 50 nm copper film from 2 K to 300 K', doi: '10.80123/ohm.ab12-cd34',
    group: { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab' }, fileName: 'LCL-CuF-21_RT_warming.csv',
  },
  chosen: { x: 'T_sample', y: 'resistivity' },
  options: [
    option('T_sample', { column: 'R', quantity: 'resistance', ucum: 'Ohm' }, [[2, 0.11], [150, 0.2], [300, 0.35]], false, 4),
    // The preview has 3 of the curve's 4 points (downsampled); the export must use all 4 (FULL below).
    option('T_sample', rho, [[2, 5.5e-9], [150, 1.0e-8], [300, 1.75e-8]], true, 4),
  ],
};

export const itoFilm: CompareEntry = {
  key: 'item-2',
  ref: { versionId: '22222222-2222-4222-8222-222222222222', fileId: 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb', x: 'T', y: 'Rs' },
  source: {
    datasetId: 'eeeeeeee-eeee-4eee-8eee-eeeeeeeeeeee', versionId: '22222222-2222-4222-8222-222222222222', versionNumber: 2,
    title: 'Van der Pauw sheet resistance of a 40 nm ITO film, 10–300 K', doi: '10.80123/ohm.ef56-gh78',
    group: { slug: 'tidewater-thin-films', name: 'Tidewater Thin Films Group' }, fileName: 'TTF-ITO-040_vdP_warming.csv',
  },
  chosen: { x: 'T', y: 'Rs' },
  options: [
    option('T', { column: 'Rs', quantity: 'sheet-resistance', ucum: 'Ohm/{sq}' }, [[10, 102.5], [300, 100]], true),
    option('T', rho, [[10, 4.1e-6], [300, 4.0e-6]], true),
  ],
};

export const localFile: CompareEntry = {
  key: 'local:1',
  ref: null,
  source: null,
  local: { fileName: 'my-sample <B>.csv', note: null },
  chosen: { x: 'T', y: 'rho' },
  options: [option('T', { column: 'rho', quantity: 'resistivity', ucum: 'Ohm.m' }, [[4, 2e-7], [250, 9e-7]])],
};

/** Full-resolution curves (SI) by entry key. */
export const FULL = new Map([
  ['item-1', { x: [2, 100, 200, 300], y: [5.5e-9, 8e-9, 1.3e-8, 1.75e-8] }],
  ['item-2', { x: [10, 300], y: [4.1e-6, 4.0e-6] }],
  ['local:1', { x: [4, 250], y: [2e-7, 9e-7] }],
]);

export const rhoOfT: OverlaySettings = {
  xKey: 'temperature|K', yKey: 'resistivity|Ohm.m', xUnit: 'K', yUnit: 'uOhm.cm', normalisation: { kind: 'none' }, logX: false, logY: false,
};
