import { describe, expect, it } from 'vitest';
import { FACET_LIST_LIMIT, FacetColumns } from '@/lib/search/facets';

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
});
