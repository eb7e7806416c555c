// Anonymous review copies (issue 6): no creator, group or affiliation string in any tag file of the package.
import { describe, expect, it } from 'vitest';
import { planBag } from '@/lib/packages/bag-layout';
import { validateWithXsd, texts } from '../datacite/xsd';
import { fileWithBytes, identifyingStrings, packageInput, RXX_CSV } from './fixtures';

describe('planBag with anonymous: true', () => {
  const input = packageInput([fileWithBytes('rxx_1p8K.csv', RXX_CSV)], { anonymous: true });
  const plan = planBag(input);
  const tag = (p: string) => plan.tagFiles.find((t) => t.path === p)!.content.toString('utf8');
  const secrets = identifyingStrings(input);

  it('knows what to look for: the fixture names 3 people, their labs, ORCID iDs and RORs', () => {
    expect(secrets).toEqual(expect.arrayContaining(['Odile Brackenridge', 'Brackenridge', 'Holt', 'Pemberton, Yusra', 'Cobalt Ridge Magnetotransport Lab', 'Meridian Transport Consortium', '0000-0000-2718-2810', 'https://ror.org/0crm3bv08']));
  });

  it.each(['bagit.txt', 'bag-info.txt', 'manifest-sha256.txt', 'README.md', 'CITATION.cff', 'citation.bib', 'metadata/ohmstead-record.json', 'metadata/datacite.xml', 'tagmanifest-sha256.txt'])(
    '%s holds none of them',
    (p) => {
      const text = tag(p).toLowerCase();
      expect(secrets.filter((s) => text.includes(s.toLowerCase()))).toEqual([]);
    },
  );

  it('leaves Source-Organization out of bag-info.txt', () => {
    expect(tag('bag-info.txt').startsWith('External-Identifier: https://doi.org/10.99999/ohm.k7p2-v2\n')).toBe(true);
  });

  it('gives DataCite one "(:unav)" creator (DataCite standard value), no contributors, and stays XSD-valid', () => {
    const xml = tag('metadata/datacite.xml');
    expect(texts(xml, 'creatorName')).toEqual(['(:unav)']);
    expect(texts(xml, 'contributorName')).toEqual([]);
    expect(texts(xml, 'affiliation')).toEqual([]);
    expect(validateWithXsd(xml).ok).toBe(true);
  });

  it('cites "Anonymous" and says why in the README', () => {
    expect(tag('CITATION.cff')).toContain('authors:\n  - name: "Anonymous"\nidentifiers:');
    expect(tag('citation.bib')).toContain('\tauthor = {{Anonymous}},');
    expect(tag('README.md')).toContain('Creators, their affiliations and the depositing group are withheld in this anonymous review copy.');
    expect(tag('README.md')).toContain('Anonymous (2026): Magnetoresistance of a Bi₂Se₃ flake');
  });

  it('marks the record JSON and drops its creators and group', () => {
    const record = JSON.parse(tag('metadata/ohmstead-record.json'));
    expect(record).toMatchObject({ anonymousReviewCopy: true, reviewCopy: true });
    expect(record).not.toHaveProperty('group');
    expect(record.metadata).not.toHaveProperty('creators');
    expect(record.metadata.sample.name).toBe('CRM-BS-F12');
  });
});
