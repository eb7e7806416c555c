import { beforeEach, describe, expect, it } from 'vitest';
import { SearchIndex } from '@/lib/search/search-index';
import type { SearchDoc, SearchQuery } from '@/lib/search/types';
import { byId, FIXTURE } from './fixtures';

// Expected ids and counts are hand-counted from the table in fixtures.ts.
let index: SearchIndex;
const ids = (q: SearchQuery) => index.search({ sort: 'date', ...q }).hits.map((h) => h.doc.versionId).sort();
const counts = (q: SearchQuery, facet: 'material' | 'quantity' | 'method' | 'excitation' | 'group' | 'year') =>
  Object.fromEntries(index.search(q).facets[facet].map((b) => [b.value, b.count]));

beforeEach(() => {
  index = new SearchIndex();
  for (const doc of FIXTURE) index.add(doc);
});

describe('facet counts', () => {
  it('counts every facet over the latest versions when nothing is selected', () => {
    const { facets, total } = index.search({});
    expect(total).toBe(7);
    expect(facets.group).toEqual([
      { value: 'larkspur-cryogenic', label: 'Larkspur Cryogenic Lab', count: 3 },
      { value: 'cobalt-ridge-magnetotransport', label: 'Cobalt Ridge Magnetotransport Lab', count: 2 },
      { value: 'tidewater-thin-films', label: 'Tidewater Thin Films Group', count: 2 },
    ]);
    expect(facets.method).toEqual([
      { value: 'four-wire', count: 3 }, { value: 'two-wire', count: 2 }, { value: 'hall-bar', count: 1 }, { value: 'van-der-pauw', count: 1 },
    ]);
    expect(facets.quantity).toEqual([
      { value: 'resistivity', count: 5 }, { value: 'magnetoresistance', count: 2 },
      { value: 'hall-resistance', count: 1 }, { value: 'sheet-resistance', count: 1 },
    ]);
    expect(facets.excitation).toEqual([{ value: 'ac', count: 3 }, { value: 'dc', count: 3 }, { value: 'dc-reversal', count: 1 }]);
    expect(facets.year).toEqual([{ value: '2025', count: 4 }, { value: '2023', count: 1 }, { value: '2024', count: 1 }, { value: '2026', count: 1 }]);
    expect(facets.material).toContainEqual({ value: 'yba2cu3o7', label: 'YBa₂Cu₃O₇₋δ', count: 1 });
    expect(facets.material).toHaveLength(7);
  });

  it("counts a facet with every other selection applied but not its own (multi-select)", () => {
    const q: SearchQuery = { group: ['larkspur-cryogenic'], method: ['two-wire'] };
    expect(ids(q)).toEqual(['a3']);
    // Groups among two-wire versions (a3 Larkspur, c2 Cobalt Ridge); methods among Larkspur versions (a1, a2 four-wire; a3 two-wire).
    expect(counts(q, 'group')).toEqual({ 'larkspur-cryogenic': 1, 'cobalt-ridge-magnetotransport': 1 });
    expect(counts(q, 'method')).toEqual({ 'four-wire': 2, 'two-wire': 1 });
    expect(counts(q, 'excitation')).toEqual({ ac: 1 });
    const selected = index.search(q).facets.group.find((b) => b.value === 'larkspur-cryogenic');
    expect(selected?.selected).toBe(true);
  });

  it('ORs values within a facet and ANDs across facets', () => {
    expect(ids({ group: ['larkspur-cryogenic', 'cobalt-ridge-magnetotransport'] })).toEqual(['a1', 'a2', 'a3', 'c1', 'c2']);
    expect(ids({ quantity: ['magnetoresistance'], excitation: ['ac'] })).toEqual(['b2v2', 'c1']);
    expect(ids({ year: ['2025'], method: ['four-wire'] })).toEqual(['a1', 'a2', 'b2v2']);
  });

  it('counts facets over the text matches only', () => {
    expect(counts({ q: 'magnetoresistance' }, 'group')).toEqual({ 'tidewater-thin-films': 1, 'cobalt-ridge-magnetotransport': 1 });
  });

  it('filters the material facet by formula in any spelling or shorthand', () => {
    expect(ids({ material: ['YBa2Cu3O7'] })).toEqual(['b1']);
    expect(ids({ material: ['ybco'] })).toEqual(['b1']);
    expect(ids({ material: ['Bi₂Se₃', 'NbTi'] })).toEqual(['a3', 'c1']);
  });

  it('gives no results, and no error, for values the index has never seen, and still lists them as selected', () => {
    const result = index.search({ material: ['Unobtainium'], group: ['no-such-lab'] });
    expect(result.total).toBe(0);
    expect(result.hits).toEqual([]);
    expect(result.facets.group).toContainEqual({ value: 'no-such-lab', count: 0, selected: true });
    expect(index.search({ year: ['1850'] }).total).toBe(0);
    expect(index.search({ excitation: ['pulsed'] }).total).toBe(0);
  });
});

describe('range filters (rangeMode covers by default, overlaps on request)', () => {
  it('temperature: covers needs the whole band, overlaps any part of it', () => {
    expect(ids({ tMin: 100, tMax: 320 })).toEqual(['b2v2', 'c2']);
    expect(ids({ tMin: 100, tMax: 320, rangeMode: 'overlaps' })).toEqual(['a1', 'b1', 'b2v2', 'c2']);
  });

  it('temperature: a single bound is a point the curve must include (covers) or a half-line (overlaps)', () => {
    expect(ids({ tMin: 9 })).toEqual(['a1', 'a2', 'a3', 'c1', 'c2']);
    expect(ids({ tMax: 3 })).toEqual(['a1', 'a3', 'c1']);
    expect(ids({ tMin: 9, rangeMode: 'overlaps' })).toHaveLength(7);
  });

  it('field: covers means the curve reaches |B| ≥ bMax; overlaps means some points at |B| ≤ bMax', () => {
    expect(ids({ bMax: 5 })).toEqual(['b2v2', 'c1']);
    expect(ids({ bMax: 10 })).toEqual(['c1']);
    expect(ids({ bMax: 5, rangeMode: 'overlaps' })).toEqual(['a1', 'a2', 'b2v2', 'c1', 'c2']);
  });

  it('frequency: covers means the curve lies inside the band; overlaps admits the 5–15 Hz sweep', () => {
    expect(ids({ fMin: 10, fMax: 20 })).toEqual(['a3', 'b2v2']);
    expect(ids({ fMin: 10, fMax: 20, rangeMode: 'overlaps' })).toEqual(['a3', 'b2v2', 'c1']);
    expect(ids({ fMax: 10 })).toEqual([]);
    expect(ids({ fMax: 10, rangeMode: 'overlaps' })).toEqual(['c1']);
  });

  it('matches a bound within 1 % of its size: a sweep logged as 2.0015–299.9998 K is a 2–300 K curve', () => {
    // Readings as a controller logs them near its set points (invented values; the tolerance is BOUND_TOLERANCE).
    const logged = new SearchIndex();
    const add = (versionId: string, ranges: SearchDoc['ranges']) =>
      logged.add({ ...byId('a1'), versionId, datasetId: `ds-${versionId}`, ranges });
    add('sweep', { temperatureK: [2.0015, 299.9998], fieldT: [-8.998, 8.998], frequencyHz: [100.4, 100.4] });
    add('short', { temperatureK: [4.5, 296], fieldT: [0, 8.9], frequencyHz: [9.95, 9.95] });
    const found = (q: SearchQuery) => logged.search({ sort: 'date', ...q }).hits.map((h) => h.doc.versionId).sort();
    expect(found({ tMin: 2, tMax: 300 })).toEqual(['sweep']);
    expect(found({ tMin: 4, tMax: 300 })).toEqual(['sweep']); // 296 K is more than 1 % short of 300 K
    expect(found({ tMin: 4.46, tMax: 293 })).toEqual(['short', 'sweep']); // 4.5 K is within 1 % of 4.46 K
    expect(found({ tMax: 300 })).toEqual(['sweep']);
    expect(found({ bMax: 9 })).toEqual(['sweep']); // 8.998 T reaches 9 T; 8.9 T does not
    expect(found({ fMin: 10, fMax: 100 })).toEqual(['short', 'sweep']); // 9.95 Hz and 100.4 Hz are within 1 % of the band
    expect(found({ fMin: 10.5, fMax: 99 })).toEqual([]);
    expect(found({ tMin: 301, rangeMode: 'overlaps' })).toEqual(['sweep']); // 299.9998 K is within 1 % of 301 K
    expect(found({ tMin: 305, rangeMode: 'overlaps' })).toEqual([]);
  });

  it('combines ranges with text and facets, and counts facets after the range filter', () => {
    expect(ids({ q: 'magnetoresistance', bMax: 10 })).toEqual(['c1']);
    expect(counts({ tMin: 100, tMax: 320 }, 'group')).toEqual({ 'tidewater-thin-films': 1, 'cobalt-ridge-magnetotransport': 1 });
  });
});

describe('versions', () => {
  it('lists only the latest version of each dataset unless all versions are asked for', () => {
    expect(ids({ q: 'manganite' })).toEqual(['b2v2']);
    expect(index.search({ q: 'manganite', allVersions: true }).hits.map((h) => h.doc.versionId)).toEqual(['b2v2', 'b2v1']);
    expect(index.search({ allVersions: true }).total).toBe(8);
    expect(counts({ allVersions: true }, 'group')['tidewater-thin-films']).toBe(3);
  });
});

describe('order and pagination', () => {
  it('lists every version newest first when there is no text', () => {
    const result = index.search({});
    expect(result.sort).toBe('date');
    expect(result.hits.map((h) => h.doc.versionId)).toEqual(['c1', 'b1', 'a2', 'a1', 'b2v2', 'a3', 'c2']);
  });

  it('pages without gaps or repeats, and a page past the end is empty with the right total', () => {
    const pages = [1, 2, 3, 4].map((page) => index.search({ page, pageSize: 3 }));
    expect(pages.map((p) => p.hits.map((h) => h.doc.versionId))).toEqual([['c1', 'b1', 'a2'], ['a1', 'b2v2', 'a3'], ['c2'], []]);
    expect(pages.every((p) => p.total === 7 && p.pageSize === 3)).toBe(true);
    const far = index.search({ page: 1_000_000_000, pageSize: 100 });
    expect(far).toMatchObject({ total: 7, page: 1_000_000_000, hits: [] });
  });

  it('pages a relevance order consistently with one large page', () => {
    const all = index.search({ q: 'wire', pageSize: 10 }).hits.map((h) => h.doc.versionId);
    const paged = [1, 2, 3].flatMap((page) => index.search({ q: 'wire', page, pageSize: 2 }).hits.map((h) => h.doc.versionId));
    expect(paged).toEqual(all);
    expect(all).toHaveLength(5);
  });

  it('walks the kept date order for a large result exactly as a full sort would order it', () => {
    // 700 copies of a2 published at scrambled times (i·379 mod 700 hours after a start), ties broken by version id.
    const start = Date.parse('2020-01-01T00:00:00Z');
    for (let i = 0; i < 700; i++) {
      const at = new Date(start + ((i * 379) % 700) * 3_600_000 + (i % 3 === 0 ? 0 : 1)).toISOString();
      index.add({ ...FIXTURE[1], versionId: `n${String(i).padStart(3, '0')}`, datasetId: `dn${i}`, publishedAt: at });
    }
    const expected = index.search({ q: 'niobium', pageSize: 100, page: 1, sort: 'relevance' }).total;
    expect(expected).toBe(701);
    const all = [...FIXTURE.filter((d) => d.versionId === 'a2'), ...Array.from({ length: 700 }, (_, i) => index.get(`n${String(i).padStart(3, '0')}`))]
      .map((d) => ({ id: d!.versionId, at: Date.parse(d!.publishedAt) }))
      .sort((a, b) => b.at - a.at || (a.id < b.id ? -1 : 1))
      .map((d) => d.id);
    const page3 = index.search({ q: 'niobium', sort: 'date', page: 3, pageSize: 50 }).hits.map((h) => h.doc.versionId);
    expect(page3).toEqual(all.slice(100, 150));
    const last = index.search({ q: 'niobium', sort: 'date', page: 15, pageSize: 50 }).hits.map((h) => h.doc.versionId);
    expect(last).toEqual(all.slice(700));
  });
});
