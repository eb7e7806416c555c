import { describe, expect, it } from 'vitest';
import { buildDataCiteJson, doiUrl, orcidUrl } from '@/lib/datacite';
import { validateTransportDataset } from '@/lib/schema';
import { conceptInput, embargoInput, fullInput, minimalInput, ROR_COBALT, ROR_FUNDER, ROR_HUB, specialCharsInput } from './fixtures';

describe('fixtures', () => {
  it('are valid transport-dataset records (schemas/transport-dataset.schema.json)', () => {
    for (const make of [minimalInput, fullInput, embargoInput, conceptInput, specialCharsInput])
      expect(validateTransportDataset(make().record)).toMatchObject({ ok: true });
  });
});

describe('buildDataCiteJson: DOI REST API attributes (DataCite REST API, JSON:API "dois" resource)', () => {
  const json = buildDataCiteJson(fullInput());

  it('names the resource type, DOI, landing URL and schema version', () => {
    expect(json.doi).toBe('10.99999/ohm.k7p2-v2');
    expect(json.url).toBe('https://ohmstead.example/datasets/k7p2/v2');
    expect(json.types).toEqual({
      resourceTypeGeneral: 'Dataset',
      resourceType: 'Electrical transport measurements',
      schemaOrg: 'Dataset',
      citeproc: 'dataset',
      bibtex: 'misc',
      ris: 'DATA',
    });
    expect(json.schemaVersion).toBe('http://datacite.org/schema/kernel-4');
    expect(json.publicationYear).toBe(2026);
    expect(json.version).toBe('2');
  });

  it('gives creators nameIdentifiers and ROR affiliations in the API field names', () => {
    expect(json.creators[1]).toEqual({
      name: 'van der Holt, Casimir',
      nameType: 'Personal',
      givenName: 'Casimir',
      familyName: 'van der Holt',
      nameIdentifiers: [{ nameIdentifier: 'https://orcid.org/0000-0000-1618-0334', nameIdentifierScheme: 'ORCID', schemeUri: 'https://orcid.org' }],
      affiliation: [
        { name: 'Cobalt Ridge Magnetotransport Lab', affiliationIdentifier: ROR_COBALT, affiliationIdentifierScheme: 'ROR', schemeUri: 'https://ror.org' },
        { name: 'Meridian Transport Consortium' },
      ],
    });
    expect(json.publisher).toEqual({ name: 'Ohmstead', publisherIdentifier: ROR_HUB, publisherIdentifierScheme: 'ROR', schemeUri: 'https://ror.org' });
    expect(json.contributors).toEqual([
      {
        name: 'Cobalt Ridge Magnetotransport Lab',
        nameType: 'Organizational',
        contributorType: 'ResearchGroup',
        nameIdentifiers: [{ nameIdentifier: ROR_COBALT, nameIdentifierScheme: 'ROR', schemeUri: 'https://ror.org' }],
        affiliation: [],
      },
    ]);
  });

  it('carries dates, rights, sizes, formats and funding', () => {
    expect(json.dates).toEqual([
      { date: '2026-03-14', dateType: 'Issued' },
      { date: '2026-09-01', dateType: 'Available' },
      { date: '2026-11-02', dateType: 'Withdrawn', dateInformation: 'Thermometer calibration error found' },
    ]);
    expect(json.rightsList).toEqual([
      {
        rights: 'Creative Commons Attribution 4.0 International',
        rightsUri: 'https://spdx.org/licenses/CC-BY-4.0.html',
        rightsIdentifier: 'CC-BY-4.0',
        rightsIdentifierScheme: 'SPDX',
        schemeUri: 'https://spdx.org/licenses/',
      },
    ]);
    expect(json.sizes).toEqual(['3 files', '581181 bytes']);
    expect(json.formats).toEqual(['text/csv', 'text/markdown']);
    expect(json.fundingReferences).toEqual([
      {
        funderName: 'Northmarch Science Council',
        funderIdentifier: ROR_FUNDER,
        funderIdentifierType: 'ROR',
        schemeUri: 'https://ror.org',
        awardNumber: 'NSC-2031-417',
        awardTitle: 'Quantum transport in layered chalcogenides',
      },
      { funderName: 'Meridian Instrument Fund' },
    ]);
    expect(json.titles).toEqual([{ title: 'Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K', lang: 'en' }]);
    expect(json.language).toBe('en');
  });

  it('strips resolver prefixes from DOIs and drops duplicate relations', () => {
    const input = minimalInput();
    input.doi = 'https://doi.org/10.99999/ohm.min1-v1';
    input.record.relatedIdentifiers = [
      { identifier: '10.99999/ohm.min1', identifierType: 'DOI', relationType: 'IsVersionOf' },
      { identifier: '10.99999/meridian.paper.9', identifierType: 'DOI', relationType: 'IsSupplementTo' },
    ];
    const out = buildDataCiteJson(input);
    expect(out.doi).toBe('10.99999/ohm.min1-v1');
    expect(out.relatedIdentifiers.map((r) => `${r.relationType} ${r.relatedIdentifier}`)).toEqual([
      'IsVersionOf 10.99999/ohm.min1',
      'IsSupplementTo 10.99999/meridian.paper.9',
    ]);
  });

  it('drops control characters from every string, as the XML must (XML 1.0 §2.2)', () => {
    const out = buildDataCiteJson(specialCharsInput());
    expect(out.descriptions[0].description).toBe('Gain < 1 & phase > 90° for "all" sweeps; ü, Å, µΩ·cm.');
  });

  it('refuses inputs no valid record can come from', () => {
    expect(() => buildDataCiteJson({ ...minimalInput(), publicationYear: 26 })).toThrow(/four-digit year/);
    expect(() => buildDataCiteJson({ ...conceptInput(), versionDois: [] })).toThrow(/version DOIs/);
    expect(() => buildDataCiteJson({ ...minimalInput(), embargoUntil: '2026-02-30' })).toThrow(/calendar day/);
    expect(() => buildDataCiteJson({ ...minimalInput(), publishedAt: 'yesterday' })).toThrow(/Not a date/);
  });
});

describe('identifier forms', () => {
  it('writes ORCID iDs as https://orcid.org/ URLs (ORCID display guidelines)', () => {
    expect(orcidUrl('0000-0000-2718-2810')).toBe('https://orcid.org/0000-0000-2718-2810');
    expect(orcidUrl('https://orcid.org/0000-0000-2718-2810')).toBe('https://orcid.org/0000-0000-2718-2810');
  });

  it('percent-encodes DOI characters a URL cannot carry (DOI Handbook §2.5.2.4)', () => {
    expect(doiUrl('10.99999/ohm.x1')).toBe('https://doi.org/10.99999/ohm.x1');
    expect(doiUrl('doi:10.99999/a<b>#c?d')).toBe('https://doi.org/10.99999/a%3Cb%3E%23c%3Fd');
  });
});
