import { readFileSync } from 'node:fs';
import path from 'node:path';
import Ajv from 'ajv';
import { describe, expect, it } from 'vitest';
import { buildCslItem, formatCitation, formatCitationText, splitPersonName } from '@/lib/citation';
import { unwrapRis } from '@/lib/citation/format-citation';
import { conceptInput, fullInput, minimalInput, specialCharsInput } from '../datacite/fixtures';

// Oracle: the CSL-JSON input schema (Citation Style Language, csl-data.json, JSON Schema draft-07).
const CSL_SCHEMA = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '../../../../shared/oracles/csl/csl-data.json'), 'utf8'));
const validateCsl = new Ajv({ allErrors: true, strict: false }).compile(CSL_SCHEMA);

describe('DataCite text citation (DataCite 4.7 recommended form: Creator (PublicationYear): Title. Version. Publisher. (resourceTypeGeneral). Identifier)', () => {
  it('formats the full fixture exactly', () => {
    expect(formatCitation(fullInput(), 'text')).toBe(
      'Brackenridge, Odile; van der Holt, Casimir; Pemberton, Yusra (2026): Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K. ' +
        'Version 2. Ohmstead. (Dataset). https://doi.org/10.99999/ohm.k7p2-v2',
    );
  });

  it('leaves out the version for the all-versions DOI and does not double a title\'s own full stop', () => {
    const input = conceptInput();
    input.record.title = 'Does Bi₂Se₃ localise weakly?';
    expect(formatCitationText(input)).toBe(
      'Brackenridge, Odile; van der Holt, Casimir; Pemberton, Yusra (2026): Does Bi₂Se₃ localise weakly? Ohmstead. (Dataset). https://doi.org/10.99999/ohm.k7p2',
    );
  });
});

describe('BibTeX through citation-js', () => {
  it('formats the full fixture exactly', () => {
    expect(formatCitation(fullInput(), 'bibtex')).toBe(
      [
        '@misc{Brackenridge2026Magnetoresistance,',
        '\tauthor = {Brackenridge, Odile and van der Holt, Casimir and Pemberton, Yusra},',
        '\tdoi = {10.99999/ohm.k7p2-v2},',
        '\tyear = {2026},',
        '\tpublisher = {Ohmstead},',
        '\ttitle = {Magnetoresistance of a {Bi2Se3} flake from 1.8 {K} to 300 {K}},',
        '\turl = {https://doi.org/10.99999/ohm.k7p2-v2},',
        '}',
        '',
      ].join('\n'),
    );
  });

  it('escapes TeX specials and writes non-ASCII as TeX accents (common BibTeX practice)', () => {
    const bib = formatCitation(specialCharsInput(), 'bibtex');
    expect(bib).toContain(
      '\ttitle = {Resistivity 12 $\\mu$$\\Omega$\\textperiodcentered{}cm of \\textless{}{Cu} \\& "{Ag}"\\textgreater{} films, ' +
        '4 {\\r {A}} roughness --- d\'{\\" {U}}rsel\'s "{Fall}" \\& \\textless{}script\\textgreater{}},',
    );
    expect(bib).toContain("\tauthor = {O'Brien-M{\\\" u}ller \\& \\textless{}Co\\textgreater{}, Zo{\\\" e} and {\\r A}ngstr{\\\" o}m, {\\\" U}mit},");
    // No raw specials survive inside the braces: an unescaped & or % would break LaTeX.
    const title = /\ttitle = \{(.*)\},\n/.exec(bib)?.[1] ?? '';
    expect(title.replace(/\\[&%$#_]/g, '')).not.toMatch(/[&%#_<>]/);
    const odd = { ...minimalInput(), record: { ...minimalInput().record, title: '50% of #3_a in {set} costs $5 ~ ^ \\' } };
    expect(formatCitation(odd, 'bibtex')).toContain(
      '\ttitle = {50\\% of \\#3\\textunderscore{}a in \\textbraceleft{}set\\textbraceright{} costs \\textdollar{}5 \\textasciitilde{} \\textasciicircum{} \\textbackslash{}},',
    );
  });
});

describe('RIS through citation-js (RIS format specification: TY  - DATA … ER  - )', () => {
  it('formats the full fixture exactly', () => {
    expect(formatCitation(fullInput(), 'ris')).toBe(
      [
        'TY  - DATA',
        'AU  - Brackenridge, Odile',
        'AU  - van der Holt, Casimir',
        'AU  - Pemberton, Yusra',
        'DA  - 2026///',
        'PY  - 2026',
        'DO  - 10.99999/ohm.k7p2-v2',
        'ET  - 2',
        'ID  - 10.99999/ohm.k7p2-v2',
        'KW  - topological insulator',
        'KW  - weak antilocalisation',
        'KW  - Bi2Se3',
        'LA  - en',
        'PB  - Ohmstead',
        'TI  - Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K',
        'UR  - https://doi.org/10.99999/ohm.k7p2-v2',
        'ER  - ',
        '',
      ].join('\n'),
    );
  });

  it('keeps a long title on one tagged line, even when tag-like text falls on the 70-character wrap', () => {
    const input = minimalInput();
    input.record.title = 'x'.repeat(70) + 'ER  - ' + 'y'.repeat(64) + 'TY  - tail';
    const ris = formatCitation(input, 'ris');
    // Titles are put on one line with single spaces first, so "ER  - " arrives as "ER - " right on the wrap point.
    expect(ris.split('\n').filter((l) => l.startsWith('TI  - '))).toEqual([`TI  - ${'x'.repeat(70)}ER - ${'y'.repeat(64)}TY - tail`]);
    expect(ris.split('\n').filter((l) => /^ER {2}- /.test(l))).toEqual(['ER  - ']);
    expect(ris.split('\n').every((l) => l === '' || /^[A-Z][A-Z0-9] {2}- /.test(l))).toBe(true);
    const special = formatCitation(specialCharsInput(), 'ris');
    expect(special).toContain(`TI  - Resistivity 12 µΩ·cm of <Cu & "Ag"> films, 4 Å roughness — d'Ürsel's "Fall" & <script>\n`);
  });

  it('unwraps a value of exactly 70 characters, which plugin-ris follows with an empty line', () => {
    expect(unwrapRis(`TI  - ${'z'.repeat(70)}\n\nUR  - u\nER  - `)).toBe(`TI  - ${'z'.repeat(70)}\nUR  - u\nER  - `);
  });
});

describe('CSL-JSON through citation-js', () => {
  it('formats the full fixture exactly', () => {
    expect(JSON.parse(formatCitation(fullInput(), 'csl-json'))).toEqual([
      {
        id: '10.99999/ohm.k7p2-v2',
        type: 'dataset',
        title: 'Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K',
        author: [
          { given: 'Odile', family: 'Brackenridge' },
          { given: 'Casimir', family: 'van der Holt' },
          { given: 'Yusra', family: 'Pemberton' },
        ],
        issued: { 'date-parts': [[2026]] },
        publisher: 'Ohmstead',
        DOI: '10.99999/ohm.k7p2-v2',
        URL: 'https://doi.org/10.99999/ohm.k7p2-v2',
        version: '2',
        keyword: 'topological insulator,weak antilocalisation,Bi2Se3',
        language: 'en',
      },
    ]);
  });

  it('validates against the CSL schema for every fixture (csl-data.json, draft-07)', () => {
    for (const make of [minimalInput, fullInput, conceptInput, specialCharsInput]) {
      const items = JSON.parse(formatCitation(make(), 'csl-json'));
      expect(validateCsl(items), JSON.stringify(validateCsl.errors)).toBe(true);
      expect(validateCsl([buildCslItem(make())])).toBe(true);
    }
  });

  it('the schema check can fail: an author given as a bare string and an unknown type are rejected', () => {
    const item = buildCslItem(fullInput());
    expect(validateCsl([{ ...item, author: ['Brackenridge, Odile'] }])).toBe(false);
    expect(validateCsl([{ ...item, type: 'data-set' }])).toBe(false);
  });
});

describe('personal names (citation-js name parser)', () => {
  it('keeps particles with the family name and reads "Family, Given"', () => {
    expect(splitPersonName('Casimir van der Holt')).toEqual({ given: 'Casimir', family: 'van der Holt' });
    expect(splitPersonName('Pemberton,  Yusra ')).toEqual({ given: 'Yusra', family: 'Pemberton' });
    expect(splitPersonName('Brackenridge')).toEqual({ family: 'Brackenridge' });
  });
});
