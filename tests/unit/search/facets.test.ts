import { describe, expect, it } from 'vitest';
import type { FacetPacks } from '@/lib/search/facet-packs';
import { FACET_LIST_LIMIT, FacetColumns } from '@/lib/search/facets';
import { seededRandom } from '../transport/physics/seeded-random';

// Counts are constructed by hand: slot s carries the values listed for it below.
function filled(perSlot: { method: string[]; material: string }[]) {
  const facets = new FacetColumns(perSlot.length);
  perSlot.forEach((v, slot) => {
    facets.columns.method.setMany(slot, v.method);
    facets.columns.material.setOne(slot, v.material);
  });
  const slots = Int32Array.from(perSlot.keys());
  return { facets, slots };
}

describe('FacetColumns', () => {
  it('lists the most frequent values first, ties alphabetically, cut at the limit but keeping selected values', () => {
    // Material m00 on 1 slot, m01 on 2, …, m39 on 40 slots: counts are the value's number plus one.
    const rows = Array.from({ length: 40 }, (_, i) => Array.from({ length: i + 1 }, () => ({ method: ['a'], material: `m${String(i).padStart(2, '0')}` }))).flat();
    rows.push({ method: ['a'], material: 'm38b' }, ...Array.from({ length: 38 }, () => ({ method: ['a'], material: 'm38b' })));
    const { facets, slots } = filled(rows);
    const selection = { material: ['m00'] };
    const { counts } = facets.filterAndCount(slots.slice(), slots.length, {});
    const list = facets.buckets(counts, selection).material;
    expect(list).toHaveLength(FACET_LIST_LIMIT + 1);
    expect(list.slice(0, 4)).toEqual([{ value: 'm39', count: 40 }, { value: 'm38', count: 39 }, { value: 'm38b', count: 39 }, { value: 'm37', count: 38 }]);
    expect(list[FACET_LIST_LIMIT - 1]).toEqual({ value: 'm11', count: 12 });
    expect(list[FACET_LIST_LIMIT]).toEqual({ value: 'm00', count: 1, selected: true });
  });

  it('keeps filtering and counting a multi-valued facet right past 32 distinct values', () => {
    // Slot s has methods x{s} and "shared"; 40 slots give 41 distinct values.
    const rows = Array.from({ length: 40 }, (_, s) => ({ method: [`x${s}`, 'shared'], material: 'm' }));
    const { facets, slots } = filled(rows);
    expect(facets.columns.method.usesBits).toBe(false);
    const picked = slots.slice();
    const { passed, counts } = facets.filterAndCount(picked, picked.length, { method: ['x35', 'x3'] });
    expect(passed).toBe(2);
    expect([...picked.subarray(0, passed)]).toEqual([3, 35]);
    const methods = facets.buckets(counts, { method: ['x35', 'x3'] }).method;
    expect(methods[0]).toEqual({ value: 'shared', count: 40 });
    const { counts: material } = facets.filterAndCount(slots.slice(), slots.length, { method: ['x35', 'x3'] });
    expect(facets.buckets(material, {}).material).toEqual([{ value: 'm', count: 2 }]);
  });

  it('counts a many-valued facet right without a selection, after a query that had one', () => {
    // 40 slots: method x{s} plus "shared", material m{s % 4}: 41 method values, too many to count by bit pattern.
    const rows = Array.from({ length: 40 }, (_, s) => ({ method: [`x${s}`, 'shared'], material: `m${s % 4}` }));
    const { facets, slots } = filled(rows);
    facets.filterAndCount(slots.slice(), slots.length, { material: ['m1'], method: ['x0'] });
    const { passed, counts } = facets.filterAndCount(slots.slice(), slots.length, {});
    expect(passed).toBe(40);
    const buckets = facets.buckets(counts, {});
    expect(buckets.method[0]).toEqual({ value: 'shared', count: 40 });
    expect(buckets.material).toEqual([0, 1, 2, 3].map((k) => ({ value: `m${k}`, count: 10 })));
  });

  it('counts packed small facets like one pass per facet, with and without selections', () => {
    // Slot s (0 … 59): quantity q{s % 3} (plus qx on every fifth), method k{s % 2}, excitation e{s % 4} (none on 3),
    // group g{s % 5}, year 20{s % 6}: every count below follows from the residues.
    const facets = new FacetColumns(60);
    for (let s = 0; s < 60; s++) {
      facets.columns.quantity.setMany(s, s % 5 === 0 ? [`q${s % 3}`, 'qx'] : [`q${s % 3}`]);
      facets.columns.method.setMany(s, [`k${s % 2}`]);
      facets.columns.excitation.setOne(s, s % 4 === 3 ? '' : `e${s % 4}`);
      facets.columns.group.setOne(s, `g${s % 5}`);
      facets.columns.year.setOne(s, `20${s % 6}`);
      facets.columns.material.setOne(s, 'm');
    }
    const all = Int32Array.from({ length: 60 }, (_, s) => s);
    const countsOf = (selection: object) => {
      const { passed, counts } = facets.filterAndCount(all.slice(), 60, selection);
      const b = facets.buckets(counts, selection);
      const map = (name: keyof typeof b) => Object.fromEntries(b[name].map((x) => [x.value, x.count]));
      return { passed, quantity: map('quantity'), method: map('method'), excitation: map('excitation'), group: map('group'), year: map('year') };
    };
    expect(countsOf({})).toEqual({
      passed: 60, quantity: { q0: 20, q1: 20, q2: 20, qx: 12 }, method: { k0: 30, k1: 30 }, excitation: { e0: 15, e1: 15, e2: 15 },
      group: { g0: 12, g1: 12, g2: 12, g3: 12, g4: 12 }, year: { 200: 10, 201: 10, 202: 10, 203: 10, 204: 10, 205: 10 },
    });
    // group g0 (s ≡ 0 mod 5) and method k1 (odd s): passing slots are s ≡ 5 mod 10 (6 slots: 5, 15, …, 55).
    // group counts: odd slots per group (6 each); method counts: slots of g0 (12), 6 even and 6 odd.
    // Others over the 6 passing slots: quantity q0 (15, 45), q1 (25, 55), q2 (5, 35), and qx on all six; excitation
    // e1 (5, 25, 45), none on 15, 35, 55; year 205 (5), 203 (15), 201 (25), 205 (35), 203 (45), 201 (55).
    expect(countsOf({ group: ['g0'], method: ['k1'] })).toEqual({
      passed: 6, quantity: { q0: 2, q1: 2, q2: 2, qx: 6 }, method: { k0: 6, k1: 6 }, excitation: { e1: 3 },
      group: { g0: 6, g1: 6, g2: 6, g3: 6, g4: 6 }, year: { 201: 2, 203: 2, 205: 2 },
    });
  });

  it('uses bit sets while a multi-valued facet has at most 32 values, with the same answers', () => {
    const rows = Array.from({ length: 32 }, (_, s) => ({ method: [`y${s}`, s % 2 ? 'odd' : 'even'], material: 'm' }));
    const { facets, slots } = filled(rows.slice(0, 30));
    expect(facets.columns.method.usesBits).toBe(true);
    const picked = slots.slice();
    const { passed, counts } = facets.filterAndCount(picked, picked.length, { method: ['odd'] });
    expect(passed).toBe(15);
    expect(Object.fromEntries(facets.buckets(counts, {}).method.map((b) => [b.value, b.count]))).toMatchObject({ odd: 15, even: 15, y0: 1 });
  });

  it('cuts the list the same way when one value has a very large count', () => {
    // "big" on 70,000 slots, then v01 … v35 on 1 … 35 slots each.
    const rows = Array.from({ length: 70_000 }, () => ({ method: ['a'], material: 'big' }));
    for (let i = 1; i <= 35; i++) for (let j = 0; j < i; j++) rows.push({ method: ['a'], material: `v${String(i).padStart(2, '0')}` });
    const { facets, slots } = filled(rows);
    const { counts } = facets.filterAndCount(slots.slice(), slots.length, {});
    const list = facets.buckets(counts, {}).material;
    expect(list).toHaveLength(FACET_LIST_LIMIT);
    expect(list[0]).toEqual({ value: 'big', count: 70_000 });
    expect(list[1]).toEqual({ value: 'v35', count: 35 });
    expect(list[FACET_LIST_LIMIT - 1]).toEqual({ value: 'v07', count: 7 });
  });

  // A reference answer computed the slow, obvious way (every slot, every facet, every value) for random data and
  // random selections; the packed passes (facet-packs.ts) must give the same slots and counts. Two layouts: the usual
  // two packs, and one pack (600 groups do not fit a pack with the years), which takes the general loop.
  it.each([
    { layout: 'two packs', groups: 12 },
    { layout: 'one pack', groups: 600 },
  ])('filters and counts like a slot-by-slot reference ($layout)', ({ layout, groups }) => {
    const random = seededRandom(groups);
    const pick = <T,>(list: readonly T[]) => list[Math.floor(random() * list.length)];
    const N = 3000;
    const values = {
      material: ['m0', 'm1', 'm2', 'm3', 'm4'],
      quantity: ['q0', 'q1', 'q2', 'q3'],
      method: ['k0', 'k1', 'k2'],
      excitation: ['dc', 'ac', 'reversal'],
      group: Array.from({ length: groups }, (_, g) => `g${g}`),
      year: ['2021', '2022', '2023', '2024', '2025'],
    };
    type Row = Record<keyof typeof values, string[]>;
    const rows: Row[] = [];
    const facets = new FacetColumns(N);
    for (let s = 0; s < N; s++) {
      const some = (list: string[]) => list.filter(() => random() < 0.35);
      const one = (list: string[]) => (random() < 0.1 ? [] : [pick(list)]); // a tenth have no value
      const row: Row = {
        material: one(values.material), quantity: some(values.quantity), method: some(values.method),
        excitation: one(values.excitation), group: one(values.group), year: one(values.year),
      };
      rows.push(row);
      facets.columns.material.setOne(s, row.material[0] ?? '');
      facets.columns.quantity.setMany(s, row.quantity);
      facets.columns.method.setMany(s, row.method);
      facets.columns.excitation.setOne(s, row.excitation[0] ?? '');
      facets.columns.group.setOne(s, row.group[0] ?? '');
      facets.columns.year.setOne(s, row.year[0] ?? '');
    }
    const packs = (facets as unknown as { packs: FacetPacks }).packs.current().length;
    expect(packs).toBe(layout === 'two packs' ? 2 : 1);
    const names = Object.keys(values) as (keyof typeof values)[];
    for (let trial = 0; trial < 60; trial++) {
      // Each facet filters with probability ½, by one to three values (now and then one the index has never seen).
      const selection: Partial<Row> = {};
      for (const name of names) {
        if (random() < 0.5) continue;
        const chosen = Array.from({ length: 1 + Math.floor(random() * 3) }, () => (random() < 0.05 ? 'unseen' : pick(values[name])));
        selection[name] = [...new Set(chosen)];
      }
      const candidates = Array.from({ length: N }, (_, s) => s).filter(() => random() < 0.6);
      const passes = (s: number, name: keyof typeof values) => !selection[name] || rows[s][name].some((v) => selection[name]!.includes(v));
      const expectedSlots = candidates.filter((s) => names.every((name) => passes(s, name)));
      const slots = Int32Array.from(candidates);
      const { passed, counts } = facets.filterAndCount(slots, slots.length, selection);
      expect([...slots.subarray(0, passed)]).toEqual(expectedSlots);
      names.forEach((name, f) => {
        const expected = new Map<string, number>();
        for (const s of candidates) {
          if (!names.every((other) => other === name || passes(s, other))) continue;
          for (const v of rows[s][name]) expected.set(v, (expected.get(v) ?? 0) + 1);
        }
        const column = facets.columns[name];
        const got = new Map<string, number>();
        counts[f].forEach((n, code) => n > 0 && got.set(column.values[code], n));
        expect(got, `${name} counts, selection ${JSON.stringify(selection)}`).toEqual(expected);
      });
    }
  });
});
