import { beforeEach, describe, expect, it } from 'vitest';
import { SearchIndex } from '@/lib/search/search-index';
import type { SearchDoc } from '@/lib/search/types';
import { byId, FIXTURE } from './fixtures';

// Expected ids and counts are hand-counted from the table in fixtures.ts.
let index: SearchIndex;
const ids = (q: object) => index.search({ sort: 'date', ...q }).hits.map((h) => h.doc.versionId);

beforeEach(() => {
  index = new SearchIndex();
  for (const doc of FIXTURE) index.add(doc);
});

describe('add, update, remove', () => {
  it('holds what was added and gives it back', () => {
    expect(index.size).toBe(8);
    const a1 = index.get('a1');
    expect(a1).toMatchObject({ versionId: 'a1', title: byId('a1').title, isLatest: true, ranges: { temperatureK: [2, 300], fieldT: [0, 0] } });
    expect(a1?.temperatureSpanK).toEqual([2, 300]);
    expect(index.get('nope')).toBeUndefined();
  });

  it('grows past a reserved capacity and gives the publication time back in ISO form', () => {
    const small = new SearchIndex({ capacity: 3 });
    for (const doc of FIXTURE) small.add(doc);
    expect(small.size).toBe(8);
    expect(small.search({}).hits.map((h) => h.doc.versionId)).toEqual(['c1', 'b1', 'a2', 'a1', 'b2v2', 'a3', 'c2']);
    expect(small.get('a1')?.publishedAt).toBe('2025-03-01T09:00:00.000Z');
    small.add({ ...byId('a2'), doi: null, description: '' });
    expect(small.get('a2')).toMatchObject({ doi: null, description: '', datasetId: 'ds-a2', title: byId('a2').title });
    small.add({ ...byId('a3'), doi: '' });
    expect(small.get('a3')?.doi).toBe('');
    expect(small.get('a1')?.doi).toBe('10.99999/ohm.a1');
  });

  it('hands out its stored lists frozen: changing a returned doc throws and does not change the index', () => {
    const doc = index.get('a1') as SearchDoc;
    expect(() => doc.methods.push('two-wire')).toThrow(TypeError);
    expect(() => (doc.group.slug = 'elsewhere')).toThrow(TypeError);
    expect(() => (doc.keywords.length = 0)).toThrow(TypeError);
    expect(() => doc.creators.unshift('A. Nother')).toThrow(TypeError);
    expect(index.get('a1')).toMatchObject({ methods: ['four-wire'], group: { slug: 'larkspur-cryogenic' }, keywords: byId('a1').keywords });
    expect(index.get('a2')?.methods).toEqual(['four-wire']); // shares the stored list with a1
  });

  it('removes a withdrawn version from words, facets, ranges and totals', () => {
    expect(index.remove('c2')).toBe(true);
    expect(index.remove('c2')).toBe(false);
    expect(index.size).toBe(7);
    expect(ids({ q: 'CuNi' })).toEqual([]);
    expect(ids({ q: 'Cu' }).sort()).toEqual(['a1', 'b1']);
    expect(index.search({}).facets.group.find((b) => b.value === 'cobalt-ridge-magnetotransport')?.count).toBe(1);
    expect(ids({ tMin: 100, tMax: 320 })).toEqual(['b2v2']);
    expect(index.search({}).total).toBe(6);
  });

  it('keeps the counts of the plain listing in step with every change', () => {
    const groups = () => Object.fromEntries(index.search({}).facets.group.map((b) => [b.value, b.count]));
    expect(groups()).toEqual({ 'larkspur-cryogenic': 3, 'tidewater-thin-films': 2, 'cobalt-ridge-magnetotransport': 2 });
    index.remove('a1');
    index.add({ ...byId('c1'), versionId: 'c3', datasetId: 'ds-c3' });
    expect(groups()).toEqual({ 'larkspur-cryogenic': 2, 'tidewater-thin-films': 2, 'cobalt-ridge-magnetotransport': 3 });
    expect(index.search({}).total).toBe(7);
    expect(index.search({ allVersions: true }).total).toBe(8);
  });

  it('re-indexes changed text: the new words find it, the old ones no longer do', () => {
    index.update({ ...byId('a1'), title: 'Four-wire ρ(T) of a silver ribbon', description: '', keywords: [], material: 'Silver ribbon', formula: 'Ag' });
    expect(ids({ q: 'silver' })).toEqual(['a1']);
    expect(ids({ q: 'annealed' })).toEqual([]);
    expect(ids({ q: 'Cu' }).sort()).toEqual(['b1', 'c2']);
    expect(ids({ material: ['Ag'] })).toEqual(['a1']);
    expect(index.size).toBe(8);
  });

  it('moves "latest" to a new version without touching the text, and back', () => {
    // A third version of b2 is published: v2 is superseded.
    index.update({ ...byId('b2v2'), isLatest: false });
    index.add({ ...byId('b2v2'), versionId: 'b2v3', versionNumber: 3, publishedAt: '2026-02-01T00:00:00Z', year: 2026 });
    expect(ids({ q: 'manganite' })).toEqual(['b2v3']);
    expect(ids({ q: 'manganite', allVersions: true })).toEqual(['b2v3', 'b2v2', 'b2v1']);
    expect(ids({})[0]).toBe('b2v3');
    // A group's name is matched through the facet words (kept per query kind until the next change): same rule.
    const tidewater = (allVersions: boolean) => ids({ q: 'tidewater', allVersions }).filter((id) => id.startsWith('b2'));
    expect(tidewater(false)).toEqual(['b2v3']);
    expect(tidewater(true)).toEqual(['b2v3', 'b2v2', 'b2v1']);
    // v3 withdrawn: v2 becomes latest again.
    index.remove('b2v3');
    index.update({ ...byId('b2v2'), isLatest: true });
    expect(ids({ q: 'manganite' })).toEqual(['b2v2']);
    expect(tidewater(false)).toEqual(['b2v2']);
  });

  it('keeps the newest-first order right through later additions and removals', () => {
    expect(ids({})).toEqual(['c1', 'b1', 'a2', 'a1', 'b2v2', 'a3', 'c2']);
    index.add({ ...byId('a2'), versionId: 'n1', datasetId: 'ds-n1', publishedAt: '2025-04-01T00:00:00Z' });
    index.remove('b1');
    index.update({ ...byId('c2'), publishedAt: '2027-01-01T00:00:00Z', year: 2027 });
    expect(ids({})).toEqual(['c2', 'c1', 'a2', 'n1', 'a1', 'b2v2', 'a3']);
  });

  it('reuses the slot of a removed version without leaking its data', () => {
    index.remove('a3');
    index.add({ ...byId('a2'), versionId: 'z1', datasetId: 'ds-z1', title: 'Zirconium strip', formula: 'Zr', material: 'Zirconium strip', description: '', ranges: {} });
    expect(ids({ q: 'NbTi' })).toEqual([]);
    expect(ids({ q: 'zirconium' })).toEqual(['z1']);
    expect(index.get('z1')?.ranges).toEqual({});
    expect(ids({ fMin: 10, fMax: 20 })).toEqual(['b2v2']);
  });

  it('stores the card sparkline at 16-bit resolution within the curve’s own box', () => {
    const stored = index.get('a1')?.sparkline as [number, number][];
    const given = byId('a1').sparkline as [number, number][];
    expect(stored).toHaveLength(3);
    stored.forEach(([x, y], i) => {
      expect(Math.abs(x - given[i][0])).toBeLessThanOrEqual((300 - 2) / 65535);
      expect(Math.abs(y - given[i][1])).toBeLessThanOrEqual((1.68e-8 - 1.7e-10) / 65535);
    });
    expect(stored[0]).toEqual([2, 1.7e-10]); // box corners are exact
    expect(stored[2]).toEqual([300, 1.68e-8]);
  });

  it('gives sparkline points back with no more digits than the 16-bit store resolves', () => {
    const curve = Array.from({ length: 64 }, (_, i) => [2 + (298 * i) / 63 + Math.PI / 1e6, 1.1 + Math.sin(i / 9) / 3] as [number, number]);
    index.add({ ...byId('a2'), sparkline: curve });
    const stored = index.get('a2')?.sparkline as [number, number][];
    const xStep = (curve[63][0] - curve[0][0]) / 65535;
    const ys = curve.map(([, y]) => y);
    const yStep = (Math.max(...ys) - Math.min(...ys)) / 65535;
    stored.forEach(([x, y], i) => {
      // Within 0.55 of a step: half a step from the store, a twentieth from the printed rounding.
      expect(Math.abs(x - curve[i][0])).toBeLessThanOrEqual(0.55 * xStep);
      expect(Math.abs(y - curve[i][1])).toBeLessThanOrEqual(0.55 * yStep);
      // The box's edges come back exact; inside it, a step of 298 K / 65535 ≈ 0.0045 K is resolved by 4 decimals and
      // one of y's (span ≈ 0.67) by 6.
      if (i > 0 && i < 63) expect(String(x).split('.')[1]?.length ?? 0).toBeLessThanOrEqual(4);
      if (y !== Math.min(...ys) && y !== Math.max(...ys)) expect(String(y).split('.')[1]?.length ?? 0).toBeLessThanOrEqual(6);
    });
    // A box wider than 655 350 units (a field sweep in A/m, say) comes back in whole units.
    const wide = Array.from({ length: 10 }, (_, i) => [i * 7.9577e5 + 0.123, i] as [number, number]);
    index.add({ ...byId('a2'), sparkline: wide });
    const back = index.get('a2')?.sparkline as [number, number][];
    back.forEach(([x], i) => {
      expect(Math.abs(x - wide[i][0])).toBeLessThanOrEqual((0.55 * (wide[9][0] - wide[0][0])) / 65535);
      if (i > 0 && i < 9) expect(Number.isInteger(x)).toBe(true);
    });
  });

  it('stores a range given high-to-low in order, and ignores one that is not finite', () => {
    index.add({ ...byId('a2'), ranges: { temperatureK: [20, 4], fieldT: [Number.NaN, 1] } });
    expect(index.get('a2')?.ranges).toEqual({ temperatureK: [4, 20] });
    expect(index.search({ tMin: 5, tMax: 19, sort: 'date' }).hits.map((h) => h.doc.versionId)).toContain('a2');
    expect(index.search({ bMax: 0, rangeMode: 'overlaps', sort: 'date' }).hits.map((h) => h.doc.versionId)).not.toContain('a2');
  });

  it('drops points that are not finite numbers from a sparkline', () => {
    index.add({ ...byId('a2'), sparkline: [[4, 1], [Number.NaN, 2], [6, Infinity], [8, 3]] });
    expect(index.get('a2')?.sparkline).toEqual([[4, 1], [8, 3]]);
  });

  it('thins a sparkline longer than 64 points to 64, keeping both ends', () => {
    const long = Array.from({ length: 200 }, (_, i) => [i, i * i] as [number, number]);
    index.add({ ...byId('a2'), sparkline: long });
    const stored = index.get('a2')?.sparkline as [number, number][];
    expect(stored).toHaveLength(64);
    expect(stored[0]).toEqual([0, 0]);
    expect(stored[63]).toEqual([199, 199 * 199]);
  });
});
