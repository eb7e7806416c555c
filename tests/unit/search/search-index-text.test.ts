import { beforeEach, describe, expect, it } from 'vitest';
import { SearchIndex } from '@/lib/search/search-index';
import { FIXTURE } from './fixtures';

// Expected ids are hand-read from the table in fixtures.ts (latest versions unless allVersions).
let index: SearchIndex;
const ids = (q: object) => index.search(q).hits.map((h) => h.doc.versionId);

beforeEach(() => {
  index = new SearchIndex();
  for (const doc of FIXTURE) index.add(doc);
});

describe('formula matching', () => {
  it('finds YBa2Cu3O7 however the formula is typed', () => {
    for (const q of ['YBa2Cu3O7', 'YBa₂Cu₃O₇', 'yba2cu3o7', 'YBa2Cu3O7-δ', 'YBCO', 'ybco', 'YBa2 Cu3 O7', 'Y Ba2 Cu3 O7']) {
      expect(ids({ q }), q).toEqual(['b1']);
    }
  });

  it('matches Bi2Se3 with and without subscripts, and La0.7Sr0.3MnO3 by formula or shorthand', () => {
    expect(ids({ q: 'Bi2Se3' })).toEqual(['c1']);
    expect(ids({ q: 'bi₂se₃' })).toEqual(['c1']);
    expect(ids({ q: 'la0.7sr0.3mno3' })).toEqual(['b2v2']);
    expect(ids({ q: 'LSMO' })).toEqual(['b2v2']);
  });

  it('finds compounds by an element they contain, the element itself ranked first', () => {
    // Cu: the copper wire (formula Cu) first, then CuNi and YBa2Cu3O7 which contain Cu.
    const cu = ids({ q: 'Cu' });
    expect(cu[0]).toBe('a1');
    expect(new Set(cu)).toEqual(new Set(['a1', 'b1', 'c2']));
    expect(ids({ q: 'Nb' })).toEqual(['a2', 'a3']);
    expect(ids({ q: 'NbTi' })).toEqual(['a3']);
    expect(ids({ q: 'Nb Ti' })).toEqual(['a3']);
  });

  it('combines a formula with other words (all words must match)', () => {
    expect(ids({ q: 'YBa2Cu3O7 film' })).toEqual(['b1']);
    expect(ids({ q: 'YBa2Cu3O7 wire' })).toEqual([]);
  });

  it('reads a capitalised element symbol that is also a common word as the element', () => {
    index.add({ ...FIXTURE[1], versionId: 'in1', datasetId: 'ds-in1', title: 'Indium foil ρ(T)', formula: 'In', material: 'Indium foil', description: '' });
    expect(ids({ q: 'In' })).toEqual(['in1']);
    // "in" as a word is ignored: the same hits as without it (and not the indium foil).
    expect(ids({ q: 'copper in wire' })).toEqual(ids({ q: 'copper wire' }));
    expect(ids({ q: 'copper in wire' })).not.toContain('in1');
  });
});

describe('text fields and ranking', () => {
  it('searches title, description, keywords, creators, group and method words', () => {
    expect(ids({ q: 'annealed' })).toEqual(['a1']);
    expect(ids({ q: 'thermal offsets' })).toEqual(['a1']);
    expect(ids({ q: 'residual resistance ratio' })).toEqual(['a1']);
    expect(ids({ q: 'Varnhold' })).toEqual(['a1']);
    expect(ids({ q: 'Tidewater', sort: 'date' })).toEqual(['b1', 'b2v2']);
    expect(ids({ q: 'hall', sort: 'date' })).toEqual(['c1']);
  });

  it('ranks title matches above matches only in the method tags', () => {
    // "wire": titles of a1 and a2; method words (four-wire / two-wire) of a3, b2v2, c2.
    const wire = index.search({ q: 'wire' });
    expect(wire.total).toBe(5);
    expect(new Set(wire.hits.slice(0, 2).map((h) => h.doc.versionId))).toEqual(new Set(['a1', 'a2']));
    expect(wire.hits[1].score).toBeGreaterThan(wire.hits[2].score);
    expect(wire.sort).toBe('relevance');
  });

  it('sorts by date when asked, newest first', () => {
    expect(ids({ q: 'wire', sort: 'date' })).toEqual(['a2', 'a1', 'b2v2', 'a3', 'c2']);
  });

  it('treats plain plurals as the singular', () => {
    expect(ids({ q: 'transitions', sort: 'date' })).toEqual(['a2', 'a3']);
  });
});

describe('highlights', () => {
  it('marks every matched word of the title as plain segments', () => {
    const [hit] = index.search({ q: 'copper wire' }).hits;
    expect(hit.doc.versionId).toBe('a1');
    expect(hit.highlights.title).toEqual([
      { text: 'Four-', match: false },
      { text: 'wire', match: true },
      { text: ' ρ(T) of an annealed ', match: false },
      { text: 'copper', match: true },
      { text: ' ', match: false },
      { text: 'wire', match: true },
      { text: ', 2–300 K', match: false },
    ]);
    expect(hit.highlights.description).toEqual([
      { text: 'Annealed ', match: false },
      { text: 'copper', match: true },
      { text: ' ', match: false },
      { text: 'wire', match: true },
      { text: ' measured with current reversal to cancel thermal offsets.', match: false },
    ]);
  });

  it('marks a formula typed without subscripts inside a title written with them', () => {
    index.add({ ...FIXTURE[3], versionId: 'b9', title: 'ρ(T) of YBa₂Cu₃O₇₋δ on SrTiO₃' });
    const hit = index.search({ q: 'YBa2Cu3O7' }).hits.find((h) => h.doc.versionId === 'b9');
    expect(hit?.highlights.title).toEqual([
      { text: 'ρ(T) of ', match: false },
      { text: 'YBa₂Cu₃O₇', match: true },
      { text: '₋δ on SrTiO₃', match: false },
    ]);
  });

  it('returns markup in a title as text, never as HTML', () => {
    index.add({ ...FIXTURE[1], versionId: 'x1', title: '<img src=x onerror=alert(1)> niobium' });
    const hit = index.search({ q: 'niobium' }).hits.find((h) => h.doc.versionId === 'x1');
    expect(hit?.highlights.title).toEqual([
      { text: '<img src=x onerror=alert(1)> ', match: false },
      { text: 'niobium', match: true },
    ]);
  });

  it('has no highlights for a query without words', () => {
    expect(index.search({}).hits.every((h) => Object.keys(h.highlights).length === 0 && h.score === 0)).toBe(true);
  });
});

describe('embargo', () => {
  it('keeps embargoed versions findable and flags them for the lock', () => {
    const [hit] = index.search({ q: 'oxide' }).hits;
    expect(hit.doc.versionId).toBe('b1');
    expect(hit.doc.embargoed).toBe(true);
  });
});

describe('matching state', () => {
  it('answers the same across the wrap of the per-query generation counter', () => {
    const before = [ids({ q: 'Cu' }), ids({ q: 'YBa2Cu3O7 film' }), ids({ q: 'wire' })];
    // Two queries short of the wrap (text-match.ts wraps below 2^27): the next three queries cross it.
    (index as unknown as { text: { gen: number } }).text.gen = (1 << 27) - 2;
    expect([ids({ q: 'Cu' }), ids({ q: 'YBa2Cu3O7 film' }), ids({ q: 'wire' })]).toEqual(before);
    expect((index as unknown as { text: { gen: number } }).text.gen).toBe(2);
  });
});
