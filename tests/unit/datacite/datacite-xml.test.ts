import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildDataCiteJson, buildDataCiteXml } from '@/lib/datacite';
import { conceptInput, embargoInput, fullInput, minimalInput, ROR_COBALT, ROR_FUNDER, ROR_HUB, SPECIAL_TITLE, specialCharsInput } from './fixtures';
import { attr, elements, ORACLE_DIR, texts, validateWithXsd, xpathString } from './xsd';

const EXAMPLES = path.join(ORACLE_DIR, 'example');

describe('XSD harness (DataCite Metadata Schema 4.7 XSD via xmllint)', () => {
  it('accepts both official DataCite example records', () => {
    const files = readdirSync(EXAMPLES).filter((f) => f.endsWith('.xml'));
    expect(files.sort()).toEqual(['datacite-example-dataset-v4.xml', 'datacite-example-full-v4.xml']);
    for (const file of files) expect(validateWithXsd(readFileSync(path.join(EXAMPLES, file), 'utf8'))).toMatchObject({ ok: true });
  });

  it('rejects a record without the mandatory publicationYear', () => {
    const broken = buildDataCiteXml(minimalInput()).replace(/\s*<publicationYear>2026<\/publicationYear>/, '');
    const verdict = validateWithXsd(broken);
    expect(verdict.ok).toBe(false);
    expect(verdict.messages).toMatch(/publicationYear/);
  });

  it('rejects a relationType outside the 4.7 vocabulary and a five-digit year', () => {
    const xml = buildDataCiteXml(minimalInput());
    expect(validateWithXsd(xml.replace('relationType="IsVersionOf"', 'relationType="IsCousinOf"')).ok).toBe(false);
    expect(validateWithXsd(xml.replace('<publicationYear>2026<', '<publicationYear>20260<')).ok).toBe(false);
  });
});

describe('buildDataCiteXml output validates against the DataCite 4.7 XSD', () => {
  const cases = { minimal: minimalInput, full: fullInput, embargo: embargoInput, concept: conceptInput, special: specialCharsInput };
  for (const [name, make] of Object.entries(cases)) {
    it(`${name} record`, () => {
      const verdict = validateWithXsd(buildDataCiteXml(make()));
      expect(verdict.messages).toMatch(/validates$/);
      expect(verdict.ok).toBe(true);
    });
  }
});

describe('DataCite 4.7 elements of the minimal record', () => {
  const xml = buildDataCiteXml(minimalInput());

  it('carries the six mandatory properties (DataCite 4.7: Identifier, Creator, Title, Publisher, PublicationYear, ResourceType)', () => {
    expect(elements(xml, 'resource')[0].namespaceURI).toBe('http://datacite.org/schema/kernel-4');
    expect(texts(xml, 'identifier')).toEqual(['10.99999/ohm.min1-v1']);
    expect(attr(xml, 'identifier', 'identifierType')).toEqual(['DOI']);
    expect(texts(xml, 'creatorName')).toEqual(['Brackenridge, Odile']);
    expect(attr(xml, 'creatorName', 'nameType')).toEqual(['Personal']);
    expect(texts(xml, 'givenName')).toEqual(['Odile']);
    expect(texts(xml, 'familyName')).toEqual(['Brackenridge']);
    expect(texts(xml, 'title')).toEqual(['Sheet resistance of a sputtered NbN film at 4 K']);
    expect(texts(xml, 'publisher')).toEqual(['Ohmstead']);
    expect(texts(xml, 'publicationYear')).toEqual(['2026']);
    expect(texts(xml, 'resourceType')).toEqual(['Electrical transport measurements']);
    expect(attr(xml, 'resourceType', 'resourceTypeGeneral')).toEqual(['Dataset']);
  });

  it('links only to its concept DOI and leaves out empty optional wrappers', () => {
    expect(texts(xml, 'relatedIdentifier')).toEqual(['10.99999/ohm.min1']);
    expect(attr(xml, 'relatedIdentifier', 'relationType')).toEqual(['IsVersionOf']);
    expect(texts(xml, 'date')).toEqual(['2026-03-14']);
    expect(attr(xml, 'date', 'dateType')).toEqual(['Issued']);
    expect(texts(xml, 'version')).toEqual(['1']);
    for (const absent of ['sizes', 'formats', 'rightsList', 'fundingReferences', 'nameIdentifier', 'language']) expect(elements(xml, absent)).toEqual([]);
    expect(texts(xml, 'contributorName')).toEqual(['Tidewater Thin Films Group']);
    expect(attr(xml, 'contributor', 'contributorType')).toEqual(['ResearchGroup']);
    expect(texts(xml, 'subject')).toEqual(['sheet resistance', 'FOS: Physical sciences']);
    expect(texts(xml, 'description')).toEqual(['Sample: TTF-NbN-03.\nMeasurement: sheet resistance.']);
    expect(attr(xml, 'description', 'descriptionType')).toEqual(['TechnicalInfo']);
  });
});

describe('DataCite 4.7 elements of the full record', () => {
  const xml = buildDataCiteXml(fullInput());

  it('gives every creator an ORCID URL, bare or URL input alike, and ROR affiliations', () => {
    expect(texts(xml, 'creatorName')).toEqual(['Brackenridge, Odile', 'van der Holt, Casimir', 'Pemberton, Yusra']);
    expect(texts(xml, 'familyName')).toEqual(['Brackenridge', 'van der Holt', 'Pemberton']);
    expect(texts(xml, 'nameIdentifier').slice(0, 3)).toEqual([
      'https://orcid.org/0000-0000-2718-2810',
      'https://orcid.org/0000-0000-1618-0334',
      'https://orcid.org/0000-0000-3141-5920',
    ]);
    expect(attr(xml, 'nameIdentifier', 'nameIdentifierScheme')).toEqual(['ORCID', 'ORCID', 'ORCID', 'ROR']);
    expect(attr(xml, 'nameIdentifier', 'schemeURI')).toEqual(['https://orcid.org', 'https://orcid.org', 'https://orcid.org', 'https://ror.org']);
    expect(texts(xml, 'affiliation')).toEqual(['Cobalt Ridge Magnetotransport Lab', 'Cobalt Ridge Magnetotransport Lab', 'Meridian Transport Consortium']);
    expect(attr(xml, 'affiliation', 'affiliationIdentifier')).toEqual([ROR_COBALT, ROR_COBALT, null]);
    expect(attr(xml, 'affiliation', 'affiliationIdentifierScheme')).toEqual(['ROR', 'ROR', null]);
    expect(attr(xml, 'publisher', 'publisherIdentifier')).toEqual([ROR_HUB]);
    expect(texts(xml, 'contributorName')).toEqual(['Cobalt Ridge Magnetotransport Lab']);
  });

  it('relates the version to its concept, neighbours and paper (DataCite 4.7 relationType vocabulary)', () => {
    const related = elements(xml, 'relatedIdentifier').map((e) => [
      e.getAttribute('relationType'),
      e.getAttribute('relatedIdentifierType'),
      e.textContent,
      e.getAttribute('resourceTypeGeneral'),
    ]);
    expect(related).toEqual([
      ['IsVersionOf', 'DOI', '10.99999/ohm.k7p2', 'Dataset'],
      ['IsNewVersionOf', 'DOI', '10.99999/ohm.k7p2-v1', 'Dataset'],
      ['IsPreviousVersionOf', 'DOI', '10.99999/ohm.k7p2-v3', 'Dataset'],
      ['IsSupplementTo', 'DOI', '10.99999/meridian.paper.2026.17', null],
      ['IsDocumentedBy', 'URL', 'https://ohmstead.example/notes/cooldown-log', null],
      ['IsReferencedBy', 'arXiv', 'arXiv:2601.01234', null],
    ]);
  });

  it('dates the issue, the embargo end (Available) and the withdrawal', () => {
    expect(elements(xml, 'date').map((e) => [e.getAttribute('dateType'), e.textContent, e.getAttribute('dateInformation')])).toEqual([
      ['Issued', '2026-03-14', null],
      ['Available', '2026-09-01', null],
      ['Withdrawn', '2026-11-02', 'Thermometer calibration error found'],
    ]);
  });

  it('lists sizes, formats, version, SPDX rights, language and funding', () => {
    expect(texts(xml, 'size')).toEqual(['3 files', '581181 bytes']); // 482113 + 97020 + 2048
    expect(texts(xml, 'format')).toEqual(['text/csv', 'text/markdown']);
    expect(texts(xml, 'version')).toEqual(['2']);
    expect(texts(xml, 'language')).toEqual(['en']);
    expect(texts(xml, 'rights')).toEqual(['Creative Commons Attribution 4.0 International']); // SPDX License List name
    expect(attr(xml, 'rights', 'rightsIdentifier')).toEqual(['CC-BY-4.0']);
    expect(attr(xml, 'rights', 'rightsIdentifierScheme')).toEqual(['SPDX']);
    expect(attr(xml, 'rights', 'rightsURI')).toEqual(['https://spdx.org/licenses/CC-BY-4.0.html']);
    expect(texts(xml, 'funderName')).toEqual(['Northmarch Science Council', 'Meridian Instrument Fund']);
    expect(texts(xml, 'funderIdentifier')).toEqual([ROR_FUNDER]);
    expect(attr(xml, 'funderIdentifier', 'funderIdentifierType')).toEqual(['ROR']);
    expect(texts(xml, 'awardNumber')).toEqual(['NSC-2031-417']);
    expect(texts(xml, 'awardTitle')).toEqual(['Quantum transport in layered chalcogenides']);
    expect(texts(xml, 'subject')).toEqual([
      'topological insulator', 'weak antilocalisation', 'Bi2Se3', 'bismuth selenide', 'magnetoresistance', 'FOS: Physical sciences',
    ]);
    expect(attr(xml, 'title', 'xml:lang')).toEqual(['en']);
  });

  it('describes the abstract and the technical set-up', () => {
    expect(attr(xml, 'description', 'descriptionType')).toEqual(['Abstract', 'TechnicalInfo']);
    expect(texts(xml, 'description')).toEqual([
      'Four-wire **R(B)** sweeps of an exfoliated flake.\n\nTwo cooldowns; see the methods note.',
      [
        'Sample: CRM-BS-F12, bismuth selenide (Bi2Se3), flake, on SiO2/Si.',
        'Geometry: voltage-contact spacing 12 µm, width 4 µm, thickness 35 nm, cross-section 0.14 µm².',
        'Contacts: Hall bar, Ti/Au, spacing 12 µm.',
        'Measurement: magnetoresistance, four-wire.',
        'Excitation: AC 100 nA at 17.77 Hz.',
        'Detection: digital lock-in amplifier, time constant 300 ms, 4-stage low-pass filter, 24 dB/oct, averaging window 2 s, 5 readings averaged.',
        'Conditions: temperature 1.8 to 300 K, field -9 to 9 T (out of plane), angle 0°, field swept in both directions at 0.2 T/min.',
        'Columns: B (field, T), Rxx (resistance, Ω), T (temperature, K).',
      ].join('\n'),
    ]);
  });
});

describe('embargo and concept records', () => {
  it('puts the embargo end in dateType Available (DataCite 4.7 dateType)', () => {
    const xml = buildDataCiteXml(embargoInput());
    expect(elements(xml, 'date').map((e) => [e.getAttribute('dateType'), e.textContent])).toEqual([
      ['Issued', '2026-03-14'],
      ['Available', '2027-01-15'],
    ]);
  });

  it('gives the all-versions DOI HasVersion links and no version number', () => {
    const xml = buildDataCiteXml(conceptInput());
    expect(texts(xml, 'identifier')).toEqual(['10.99999/ohm.k7p2']);
    expect(elements(xml, 'version')).toEqual([]);
    const hasVersion = elements(xml, 'relatedIdentifier').filter((e) => e.getAttribute('relationType') === 'HasVersion');
    expect(hasVersion.map((e) => e.textContent)).toEqual(['10.99999/ohm.k7p2-v1', '10.99999/ohm.k7p2-v2', '10.99999/ohm.k7p2-v3']);
    expect(attr(xml, 'relatedIdentifier', 'relationType')).not.toContain('IsVersionOf');
    expect(attr(xml, 'date', 'dateType')).toEqual(['Issued']);
  });
});

describe('markup characters and non-ASCII text', () => {
  const input = specialCharsInput();
  const xml = buildDataCiteXml(input);

  it('escapes & < > so both parsers read back the exact title (XML 1.0 §2.4)', () => {
    expect(xml).toContain('&lt;Cu &amp; "Ag"&gt;');
    expect(xml).not.toContain('<script>');
    expect(texts(xml, 'title')).toEqual([SPECIAL_TITLE]);
    expect(xpathString(xml, "//*[local-name()='title']")).toBe(SPECIAL_TITLE);
  });

  it('keeps names, affiliations and keywords intact and drops the control character XML 1.0 cannot carry', () => {
    const json = buildDataCiteJson(input);
    expect(texts(xml, 'creatorName')).toEqual(json.creators.map((c) => c.name));
    expect(texts(xml, 'creatorName')).toEqual([`O'Brien-Müller & <Co>, Zoë`, 'Ångström, Ümit']);
    expect(texts(xml, 'givenName')).toEqual(['Zoë', 'Ümit']);
    expect(texts(xml, 'nameIdentifier')).toEqual(['https://orcid.org/0000-0000-3141-5920']);
    expect(texts(xml, 'affiliation')).toEqual(['Tidewater "Thin" Films & <Group>']);
    expect(texts(xml, 'subject').slice(0, 3)).toEqual(['µΩ·cm', 'R < 1 Ω', 'Ü & Å']);
    expect(texts(xml, 'description')[0]).toBe('Gain < 1 & phase > 90° for "all" sweeps; ü, Å, µΩ·cm.');
  });
});
