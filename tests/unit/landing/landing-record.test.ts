// The landing page's reading of a stored record (pure): units with SI prefixes, words for codes, and no crash on
// whatever a draft may hold.
import { describe, expect, it } from 'vitest';
import { buildCurves, unitOptionsFor } from '@/lib/datasets/landing-curves';
import { readCreators, readLandingRecord } from '@/lib/datasets/landing-record';
import type { FileSummary } from '@/lib/transport/summary/types';

describe('readLandingRecord', () => {
  it('writes amounts in the author’s unit with SI-prefixed labels and codes as words', () => {
    const r = readLandingRecord({
      sample: {
        name: 'TTF-Pd-014', form: 'thin-film', geometry: { thickness: { value: 100, unit: 'nm' }, width: { value: 1.25, unit: 'um' } },
        contacts: { configuration: 'van-der-pauw' },
      },
      measurement: {
        quantity: 'sheet-resistance', mode: 'four-wire',
        excitation: { type: 'dc-reversal', currentAmplitude: { value: 10, unit: 'uA' } },
        detection: { instrumentType: 'analog-lock-in', timeConstant: { value: 0.3, unit: 's' }, filterSlope: 24, averagingCount: 16 },
      },
      environment: { fieldRange: { min: -9, max: 9, unit: 'T' }, fieldOrientation: 'in-plane-parallel-to-current', angle: { value: 45, unit: 'deg' } },
      license: 'CC0-1.0',
    });
    expect(r.sample).toEqual([{ label: 'Form', value: 'thin film' }]);
    expect(r.geometry).toEqual([{ label: 'Width', value: '1.25 µm' }, { label: 'Thickness', value: '100 nm' }]);
    expect(r.contacts).toEqual([{ label: 'Configuration', value: 'van der Pauw' }]);
    expect(r.measurement).toEqual([{ label: 'Quantity', value: 'sheet resistance' }, { label: 'Wiring', value: 'four-wire' }]);
    expect(r.excitation).toEqual([{ label: 'Type', value: 'DC with current reversal' }, { label: 'Current', value: '10 µA' }]);
    expect(r.detection).toEqual([
      { label: 'Instrument', value: 'analogue lock-in amplifier' }, { label: 'Time constant', value: '300 ms' },
      { label: 'Filter slope', value: '24 dB/oct' }, { label: 'Readings averaged', value: '16' },
    ]);
    // −9 T to 9 T: the minus sign is typeset (U+2212), the unit shared.
    expect(r.environment).toEqual([
      { label: 'Field', value: '\u22129 to 9 T' }, { label: 'Field orientation', value: 'in plane, parallel to the current' },
      { label: 'Angle', value: '45°' },
    ]);
    expect(r.license).toEqual({ id: 'CC0-1.0', name: 'Creative Commons Zero v1.0 Universal', url: 'https://spdx.org/licenses/CC0-1.0.html' });
  });

  it('links only identifiers it can resolve, never a javascript: URL', () => {
    const r = readLandingRecord({
      relatedIdentifiers: [
        { identifier: 'javascript:alert(1)', identifierType: 'URL', relationType: 'References' },
        { identifier: '2401.01234', identifierType: 'arXiv', relationType: 'IsDocumentedBy' },
        { identifier: '978-3-16-148410-0', identifierType: 'ISBN', relationType: 'Cites' },
      ],
    });
    expect(r.related).toEqual([
      { relation: 'References', identifier: 'javascript:alert(1)', href: null },
      { relation: 'Is documented by', identifier: '2401.01234', href: 'https://arxiv.org/abs/2401.01234' },
      { relation: 'Cites', identifier: '978-3-16-148410-0', href: null },
    ]);
  });

  it('skips what a draft holds in the wrong shape instead of failing', () => {
    const r = readLandingRecord({ sample: { geometry: { width: { value: '3', unit: 'mm' }, thickness: 'thin' } }, keywords: 'x', creators: 7 });
    expect(r.geometry).toEqual([]);
    expect(r.keywords).toEqual([]);
    expect(readLandingRecord(null).description).toBeNull();
    expect(readCreators({ creators: [{ name: '  ' }, { name: 'Imogen Vale', orcid: '0000-0000-3141-5920', affiliation: [{}] }] })).toEqual([
      { name: 'Imogen Vale', orcid: '0000-0000-3141-5920', orcidUrl: 'https://orcid.org/0000-0000-3141-5920', affiliations: [] },
    ]);
  });
});

describe('plot units', () => {
  it('offers the units of the catalogue for each SI unit, SI first; field-strength units join tesla (1 Oe ↔ 1e-4 T)', () => {
    expect(unitOptionsFor('Ohm.m').map((u) => [u.ucum, u.factor])).toEqual([['Ohm.m', 1], ['Ohm.cm', 0.01], ['uOhm.cm', 1e-8]]);
    const oe = unitOptionsFor('T').find((u) => u.ucum === 'Oe');
    expect(oe).toMatchObject({ label: 'Oe', offset: 0 });
    expect(oe!.factor).toBeCloseTo(1e-4, 12);
    // Celsius: T[K] = t[°C] + 273.15, so shown = (K − 273.15)/1.
    const cel = unitOptionsFor('K').find((u) => u.ucum === 'Cel')!;
    expect((300 - cel.offset) / cel.factor).toBeCloseTo(26.85, 9);
    expect(unitOptionsFor('{counts}')).toEqual([{ ucum: '{counts}', label: '{counts}', factor: 1, offset: 0 }]);
  });

  it('keeps only files with curves and lists the units of every axis', () => {
    const summary = (previews: FileSummary['previews']) => ({ previews, derived: [], quality: [], columns: [], notComputed: [] }) as unknown as FileSummary;
    const curves = buildCurves([
      { fileId: 'a', fileName: 'a.csv', summary: summary([{ x: 'T', y: 'R', xUcum: 'K', yUcum: 'Ohm', sourcePoints: 2, points: [[2, 1], [3, 2]], derived: false }]) },
      { fileId: 'b', fileName: 'b.bin', summary: summary([]) },
    ]);
    expect(curves.files.map((f) => f.fileId)).toEqual(['a']);
    expect(Object.keys(curves.units).sort()).toEqual(['K', 'Ohm']);
    expect(curves.units.Ohm.map((u) => u.ucum)).toEqual(['Ohm', 'mOhm', 'kOhm', 'MOhm']);
  });
});
