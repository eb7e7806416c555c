import { describe, expect, it } from 'vitest';
import { buildDatasetJsonLd, isEmbargoed, serializeJsonLd, variablesFromSummaries } from '@/lib/jsonld';
import { summariseFile } from '@/lib/transport/summarise-file';
import type { ColumnSummary } from '@/lib/transport/summary/types';
import { fullInput, minimalInput, ROR_COBALT, ROR_FUNDER, ROR_HUB, specialCharsInput } from '../datacite/fixtures';

const column = (c: Partial<ColumnSummary> & Pick<ColumnSummary, 'name' | 'quantity' | 'range'>) =>
  ({ ucum: null, siUcum: null, converted: false, ...c }) as Pick<ColumnSummary, 'name' | 'quantity' | 'ucum' | 'siUcum' | 'converted' | 'range'>;

const BEFORE_EMBARGO = new Date('2026-05-01T12:00:00Z');

describe('buildDatasetJsonLd (schema.org Dataset)', () => {
  const variables = variablesFromSummaries([
    { columns: [column({ name: 'B', quantity: 'field', ucum: 'T', siUcum: 'T', converted: true, range: { min: -9, max: 9 } })] },
  ]);
  const ld = buildDatasetJsonLd({ ...fullInput(), variables, now: BEFORE_EMBARGO });

  it('identifies the dataset by its DOI, as PropertyValue and URL', () => {
    expect(ld['@context']).toBe('https://schema.org');
    expect(ld['@type']).toBe('Dataset');
    expect(ld['@id']).toBe('https://doi.org/10.99999/ohm.k7p2-v2');
    expect(ld.identifier).toEqual([
      { '@type': 'PropertyValue', propertyID: 'DOI', value: '10.99999/ohm.k7p2-v2', url: 'https://doi.org/10.99999/ohm.k7p2-v2' },
      'https://doi.org/10.99999/ohm.k7p2-v2',
    ]);
    expect(ld.url).toBe('https://ohmstead.example/datasets/k7p2/v2');
    expect(ld.name).toBe('Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K');
    expect(ld.version).toBe('2');
    expect(ld.datePublished).toBe('2026-03-14');
    expect(ld.license).toBe('https://spdx.org/licenses/CC-BY-4.0.html');
    expect(ld.inLanguage).toBe('en');
  });

  it('names creators as Person with ORCID @id and ROR-identified Organization affiliations', () => {
    expect((ld.creator as unknown[])[1]).toEqual({
      '@type': 'Person',
      '@id': 'https://orcid.org/0000-0000-1618-0334',
      identifier: 'https://orcid.org/0000-0000-1618-0334',
      name: 'Casimir van der Holt',
      givenName: 'Casimir',
      familyName: 'van der Holt',
      affiliation: [
        { '@type': 'Organization', '@id': ROR_COBALT, identifier: ROR_COBALT, name: 'Cobalt Ridge Magnetotransport Lab' },
        { '@type': 'Organization', name: 'Meridian Transport Consortium' },
      ],
    });
    expect((ld.creator as { name: string }[])[2].name).toBe('Yusra Pemberton');
    expect(ld.publisher).toEqual({ '@type': 'Organization', '@id': ROR_HUB, identifier: ROR_HUB, name: 'Ohmstead' });
    expect(ld.sourceOrganization).toEqual({ '@type': 'Organization', '@id': ROR_COBALT, identifier: ROR_COBALT, name: 'Cobalt Ridge Magnetotransport Lab' });
    expect(ld.funder).toEqual([
      { '@type': 'Organization', '@id': ROR_FUNDER, name: 'Northmarch Science Council', identifier: ROR_FUNDER },
      { '@type': 'Organization', name: 'Meridian Instrument Fund' },
    ]);
  });

  it('states free access, the embargo condition, technique, variables and downloads', () => {
    expect(ld.isAccessibleForFree).toBe(true);
    expect(ld.conditionsOfAccess).toBe('Files are under embargo until 2026-09-01; the metadata is public.');
    expect(ld.measurementTechnique).toBe(
      'Four-wire magnetoresistance measurement; Hall bar contacts; AC 100 nA at 17.77 Hz excitation; digital lock-in amplifier detection',
    );
    // schema.org unitCode: non-UN/CEFACT codes carry a prefix and a colon.
    expect(ld.variableMeasured).toEqual([
      { '@type': 'PropertyValue', name: 'field', alternateName: 'B', unitCode: 'UCUM:T', unitText: 'T', minValue: -9, maxValue: 9 },
    ]);
    expect(ld.distribution).toEqual([
      { '@type': 'DataDownload', name: 'rxx_1p8K.csv', contentUrl: 'https://ohmstead.example/files/1', encodingFormat: 'text/csv', contentSize: '482113 B', sha256: 'a'.repeat(64) },
      { '@type': 'DataDownload', name: 'rxx_300K.csv', encodingFormat: 'text/csv', contentSize: '97020 B' },
      { '@type': 'DataDownload', name: 'README.md', encodingFormat: 'text/markdown', contentSize: '2048 B' },
    ]);
  });

  it('drops the embargo condition from the embargo day on (UTC)', () => {
    expect(buildDatasetJsonLd({ ...fullInput(), now: new Date('2026-09-01T00:00:00Z') }).conditionsOfAccess).toBeUndefined();
    expect(isEmbargoed('2026-09-01', new Date('2026-08-31T23:59:59Z'))).toBe(true);
    expect(isEmbargoed(null, BEFORE_EMBARGO)).toBe(false);
  });

  it('falls back to the technical summary when there is no description, and omits what is unknown', () => {
    const minimal = buildDatasetJsonLd(minimalInput());
    expect(minimal.description).toBe('Sample: TTF-NbN-03.\nMeasurement: sheet resistance.');
    for (const key of ['license', 'variableMeasured', 'conditionsOfAccess', 'funder', 'keywords']) expect(minimal).not.toHaveProperty(key);
    expect(minimal.distribution).toEqual([]);
  });
});

describe('variablesFromSummaries', () => {
  it('merges columns by quantity and unit and widens ranges', () => {
    const vars = variablesFromSummaries([
      { columns: [column({ name: 'T', quantity: 'temperature', ucum: 'K', siUcum: 'K', converted: true, range: { min: 2, max: 300 } })] },
      {
        columns: [
          column({ name: 'Temp', quantity: 'temperature', ucum: 'K', siUcum: 'K', converted: true, range: { min: 1.8, max: 10 } }),
          column({ name: 'aux', quantity: 'other', range: null }),
        ],
      },
    ]);
    expect(vars).toEqual([
      { name: 'T', quantity: 'temperature', ucum: 'K', min: 1.8, max: 300 },
      { name: 'aux', quantity: 'other', ucum: null },
    ]);
  });

  it('reads SI ranges from real file summaries (lib/transport summariseFile)', async () => {
    async function* bytes(text: string) {
      yield new TextEncoder().encode(text);
    }
    const a = await summariseFile(bytes('T (K),R (mOhm)\n2,0.5\n150,6\n300,12\n'), { fileName: 'a.csv' });
    const b = await summariseFile(bytes('T (K),R (mOhm)\n1.8,0.4\n10,1\n'), { fileName: 'b.csv' });
    const vars = variablesFromSummaries([a, b]);
    expect(vars.map((v) => [v.quantity, v.ucum])).toEqual([['temperature', 'K'], ['resistance', 'Ohm']]);
    expect(vars[0]).toMatchObject({ min: 1.8, max: 300 });
    expect(vars[1].min).toBeCloseTo(0.0004, 12); // 0.4 mΩ in Ω
    expect(vars[1].max).toBeCloseTo(0.012, 12); // 12 mΩ in Ω
    const ld = buildDatasetJsonLd({ ...minimalInput(), variables: vars });
    expect((ld.variableMeasured as { unitCode: string; unitText: string }[])[1]).toMatchObject({ unitCode: 'UCUM:Ohm', unitText: 'Ω' });
  });
});

describe('serializeJsonLd for <script type="application/ld+json">', () => {
  it('escapes < > & and U+2028/9 so no text can close the script element (HTML Living Standard, script content restrictions)', () => {
    const data = { description: '</script><script>alert("x")</script> & <!-- R < 1 Ω\u2028' };
    const text = serializeJsonLd(data);
    expect(text).not.toMatch(/[<>&\u2028\u2029]/);
    expect(text).toBe(
      '{"description":"\\u003c/script\\u003e\\u003cscript\\u003ealert(\\"x\\")\\u003c/script\\u003e \\u0026 \\u003c!-- R \\u003c 1 Ω\\u2028"}',
    );
    expect(JSON.parse(text)).toEqual(data);
  });

  it('keeps a whole dataset with markup in its fields parseable and inert', () => {
    const ld = buildDatasetJsonLd(specialCharsInput());
    const text = serializeJsonLd(ld);
    expect(text).not.toContain('<');
    expect(JSON.parse(text)).toEqual(ld);
    expect((JSON.parse(text) as { name: string }).name).toContain('<script>');
  });
});
