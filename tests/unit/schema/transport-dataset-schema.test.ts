import { describe, expect, it } from 'vitest';
import schema from '@/schemas/transport-dataset.schema.json';
import { isValidOrcid, orcidCheckDigit, validateTransportDataset } from '@/lib/schema';
import { KEYWORDS_WITH_MESSAGES } from '@/lib/schema/messages';
import { unitInfo } from '@/lib/transport/units';

const example = () => structuredClone(schema.examples[0]) as Record<string, unknown> & {
  sample: { geometry: Record<string, unknown> };
  creators: { orcid?: string }[];
  measurement: { detection: Record<string, unknown> };
};

function errorsOf(record: unknown, partial = false) {
  const r = validateTransportDataset(record, { partial });
  return r.ok ? [] : r.errors;
}

describe('transport dataset schema', () => {
  it('has a versioned $id and JSON Schema 2020-12', () => {
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.$id).toMatch(/^https:\/\/ohmstead\.example\/schemas\/transport-dataset\/\d+\.\d+\.\d+$/);
    expect(schema.required).toEqual(expect.arrayContaining(['title', 'creators', 'sample', 'measurement']));
  });

  it('accepts every embedded example record', () => {
    expect(schema.examples.length).toBeGreaterThanOrEqual(1);
    for (const record of schema.examples) expect(validateTransportDataset(record)).toEqual({ ok: true, value: record });
  });

  it('reports a non-positive thickness at its field path in plain language', () => {
    const r = example();
    r.sample.geometry.thickness = { value: 0, unit: 'nm' };
    expect(errorsOf(r)).toEqual([{ path: 'sample.geometry.thickness.value', keyword: 'exclusiveMinimum', message: 'Thickness must be greater than 0.' }]);
  });

  it('names missing required fields with their titles', () => {
    const { title: _title, sample: _sample, ...rest } = example();
    expect(errorsOf(rest)).toEqual(
      expect.arrayContaining([
        { path: 'title', keyword: 'required', message: 'Title is required.' },
        { path: 'sample', keyword: 'required', message: 'Sample is required.' },
      ]),
    );
  });

  it('explains enum, type, unit, pattern, additionalProperties and uniqueItems errors', () => {
    const r = example();
    r.license = 'CC-BY';
    r.sample.geometry.width = { value: 1, unit: 'inch' };
    r.measurement.detection.filterOrder = 2.5;
    r.relatedIdentifiers = [{ identifier: 'doi:10.1/x', identifierType: 'DOI', relationType: 'IsSupplementTo' }];
    r.colour = 'copper';
    r.keywords = ['Cu', 'RRR', 'Cu'];
    const errors = errorsOf(r);
    const byPath = Object.fromEntries(errors.map((e) => [e.path, e]));
    expect(byPath.license.message).toMatch(/^Licence must be one of: CC-BY-4.0, CC-BY-SA-4.0/);
    expect(byPath['sample.geometry.width.unit']).toMatchObject({ keyword: 'enum', message: expect.stringMatching(/^Width unit must be one of: m, cm, mm, um, nm/) });
    expect(byPath['measurement.detection.filterOrder']).toEqual({ path: 'measurement.detection.filterOrder', keyword: 'type', message: 'Low-pass filter order (stages) must be a whole number.' });
    expect(byPath['relatedIdentifiers.0.identifier']).toEqual({
      path: 'relatedIdentifiers.0.identifier',
      keyword: 'pattern',
      message: 'DOI is not in the expected form (for example 10.99999/ohmstead.demo.0001).',
    });
    expect(byPath.colour).toEqual({ path: 'colour', keyword: 'additionalProperties', message: '"colour" is not a field of the dataset record.' });
    expect(byPath.keywords.message).toBe('Keywords must not list the same entry twice (entries 1 and 3 are equal).');
    expect(errors.some((e) => e.keyword === 'if')).toBe(false);
  });

  it('checks the ORCID iD check digit, reporting one error per field', () => {
    const r = example();
    r.creators[0].orcid = '0000-0000-3141-5921'; // last digit off by one
    expect(errorsOf(r)).toEqual([
      { path: 'creators.0.orcid', keyword: 'format', message: 'ORCID iD is not a valid ORCID iD (its last character, the check digit, does not match the other digits).' },
    ]);
    r.creators[0].orcid = '0000-003-1415-9269';
    expect(errorsOf(r)).toEqual([{ path: 'creators.0.orcid', keyword: 'pattern', message: 'ORCID iD is not in the expected form (for example 0000-0000-3141-5920).' }]);
  });

  it('partial mode ignores missing and still-empty fields but keeps wrong values', () => {
    expect(validateTransportDataset({}, { partial: true })).toEqual({ ok: true, value: {} });
    expect(validateTransportDataset({ title: '', creators: [] }, { partial: true }).ok).toBe(true);
    expect(errorsOf({ title: 5, sample: { form: 'crystal', geometry: { width: { value: -1 } } } }, true)).toEqual([
      { path: 'title', keyword: 'type', message: 'Title must be text.' },
      { path: 'sample.form', keyword: 'enum', message: expect.stringMatching(/^Sample form must be one of: single-crystal, polycrystal, thin-film/) },
      { path: 'sample.geometry.width.value', keyword: 'exclusiveMinimum', message: 'Width must be greater than 0.' },
    ]);
    // The same draft is incomplete in full mode.
    expect(errorsOf({}).map((e) => e.path).sort()).toEqual(['creators', 'measurement', 'sample', 'title']);
  });

  it('rejects a non-object record with a readable message', () => {
    expect(errorsOf(42)).toEqual([{ path: '', keyword: 'type', message: 'Transport dataset must be a group of fields.' }]);
  });

  it('has a plain-language message for every validation keyword the schema uses', () => {
    // Keys that annotate or structure the schema; every other keyword can fail and needs a message.
    const structural = new Set(['$schema', '$id', '$ref', '$defs', 'title', 'description', 'examples', 'properties', 'items', 'if', 'then']);
    const used = new Set<string>();
    const walk = (node: unknown): void => {
      if (Array.isArray(node)) return node.forEach(walk);
      if (!node || typeof node !== 'object') return;
      for (const [key, value] of Object.entries(node)) {
        if (key === 'examples' || key === 'enum' || key === 'required') {
          if (key !== 'examples') used.add(key);
          continue;
        }
        if (key === 'properties' || key === '$defs') Object.values(value as object).forEach(walk);
        else {
          if (!structural.has(key)) used.add(key);
          walk(value);
        }
      }
    };
    walk(schema);
    expect([...used].sort()).toEqual(
      ['additionalProperties', 'const', 'enum', 'exclusiveMinimum', 'format', 'maxItems', 'maxLength', 'maximum', 'minItems', 'minLength', 'minimum', 'pattern', 'required', 'type', 'uniqueItems'],
    );
    for (const keyword of used) expect(KEYWORDS_WITH_MESSAGES).toContain(keyword);
  });

  it('uses only UCUM codes the units module knows for lengths, areas, currents, times, temperatures, fields, angles, frequencies', () => {
    const defs = schema.$defs as Record<string, { enum?: string[]; properties?: { unit?: { enum?: string[] } } }>;
    const codes = ['lengthUnit', 'areaUnit', 'currentUnit', 'timeUnit', 'temperatureUnit', 'fieldUnit', 'angleUnit'].flatMap((n) => defs[n].enum ?? []);
    codes.push(...(defs.positiveFrequency.properties?.unit?.enum ?? []));
    expect(codes.length).toBeGreaterThan(25);
    for (const code of codes) expect(unitInfo(code), code).toBeDefined();
  });
});

describe('ORCID check digit (ISO 7064 MOD 11-2)', () => {
  it('matches the example iD in ORCID\'s own documentation of the identifier structure', () => {
    // ORCID, "Structure of the ORCID Identifier": 0000-0002-1825-0097 (check digit 7).
    expect(orcidCheckDigit('000000021825009')).toBe('7');
    expect(isValidOrcid('https://orcid.org/0000-0002-1825-0097')).toBe(true);
  });

  it('accepts X as the check digit value 10 and rejects a changed digit', () => {
    // 0000-0002-1694-233X, the iD ORCID's documentation shows for an X check digit (from memory).
    expect(isValidOrcid('0000-0002-1694-233X')).toBe(true);
    expect(isValidOrcid('0000-0002-1694-2330')).toBe(false);
    expect(isValidOrcid('0000-0000-3141-5920')).toBe(true);
  });
});
