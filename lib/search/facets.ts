// Facet values of every indexed version as small integer codes, the facet filters of a query, and their counts.
// FlexSearch's own tag filter is unreliable in 0.8.212 (stack.md), so filtering and counting happen here, in tight
// loops over typed arrays (facet-column.ts): the small facets in packs, filtered in one pass and counted in another
// (facet-packs.ts), and each larger facet (material, usually) in a pass of its own.
import { FacetColumn } from './facet-column';
import { FacetPacks } from './facet-packs';
import { formulaKey, FORMULA_ALIASES } from './normalise-formula';
import { FACET_NAMES, type FacetBucket, type FacetName, type SearchQuery } from './types';

/** How many values each facet lists (most frequent first); selected values are always listed as well. */
export const FACET_LIST_LIMIT = 30;

export type FacetSelection = Partial<Record<FacetName, readonly string[]>>;

/** A quantity, method, excitation or group value as stored and compared: trimmed, lower case. */
export function facetValue(value: string): string {
  return value.trim().toLowerCase();
}

/** A query's facet values as the columns store them: material by formula key (shorthands expanded), the rest trimmed. */
export function facetSelection(query: SearchQuery): FacetSelection {
  const clean = (values?: string[]) => (values ?? []).map(facetValue);
  const material = (query.material ?? []).flatMap((v) => {
    const key = formulaKey(v);
    return FORMULA_ALIASES[key] ? [key, ...FORMULA_ALIASES[key]] : [key];
  });
  return {
    material,
    quantity: clean(query.quantity),
    method: clean(query.method),
    excitation: clean(query.excitation),
    group: clean(query.group),
    year: (query.year ?? []).map((v) => v.trim()),
  };
}

/** Whether a selection filters at all. */
export function selectsAnything(selection: FacetSelection): boolean {
  return Object.values(selection).some((values) => values && values.length > 0);
}

/** All six facets, with the "counts reflect the other selections" pass. */
export class FacetColumns {
  readonly columns: Record<FacetName, FacetColumn>;
  private readonly ordered: FacetColumn[];
  private readonly packs: FacetPacks;
  private fail = new Uint8Array(0);

  constructor(capacity: number) {
    this.columns = {
      material: new FacetColumn(false, capacity),
      quantity: new FacetColumn(true, capacity),
      method: new FacetColumn(true, capacity),
      excitation: new FacetColumn(false, capacity),
      group: new FacetColumn(false, capacity),
      year: new FacetColumn(false, capacity),
    };
    this.ordered = FACET_NAMES.map((name) => this.columns[name]);
    this.packs = new FacetPacks(this.ordered);
    this.packs.grow(capacity);
  }

  grow(capacity: number): void {
    for (const column of this.ordered) column.grow(capacity);
    this.packs.grow(capacity);
    this.fail = new Uint8Array(capacity);
  }

  clear(slot: number): void {
    for (const column of this.ordered) column.clear(slot);
  }

  /**
   * Applies the facet filters to `slots` (already text- and range-filtered): the slots passing every facet are
   * written to the front of `slots` (their count returned as `passed`), and each facet is counted over the slots
   * that pass every *other* facet filter, so a multi-select facet shows what adding a value would give.
   */
  filterAndCount(slots: Int32Array, length: number, selection: FacetSelection): { passed: number; counts: Int32Array[] } {
    const fail = this.fail.length >= length ? this.fail : (this.fail = new Uint8Array(length));
    fail.fill(0, 0, length);
    if (!selectsAnything(selection)) return { passed: length, counts: this.countAll(slots, length, fail, 0) };
    const flags = FACET_NAMES.map((name, f) => {
      const values = selection[name];
      return values?.length ? this.ordered[f].selection(values) : null;
    });
    const packed = this.packs.markFailures(slots, length, fail, (f) => flags[f]);
    length = packed.length;
    let active = packed.marked;
    flags.forEach((selected, f) => {
      if (!selected || (packed.marked >> f) & 1) return;
      this.ordered[f].markFailures(slots, length, selected, fail, 1 << f);
      // A slot failing two facets counts for none of them and never passes: drop it, so later passes read fewer
      // (and every slot counted below fails at most one facet).
      if (active !== 0) length = dropDoubleFailures(slots, fail, length);
      active |= 1 << f;
    });
    const counts = this.countAll(slots, length, fail, active);
    let passed = 0;
    for (let i = 0; i < length; i++) if (fail[i] === 0) slots[passed++] = slots[i];
    return { passed, counts };
  }

  // Small facets in packs, one pass per pack (facet-packs.ts); each other facet in its own tight loop (faster than one
  // loop over all). A facet's own failures are ignored for its count. Single-valued facets count codes; multi-valued
  // ones with few values count bit patterns, expanded after. `active`: bit f set when facet f filters.
  private countAll(slots: Int32Array, length: number, fail: Uint8Array, active: number): Int32Array[] {
    const counts: Int32Array[] = [];
    this.packs.countAll(slots, length, fail, active, counts);
    return this.ordered.map((column, f) => {
      if (counts[f]) return counts[f];
      const shared = column.countKeys();
      if (!shared) return column.count(slots, length, fail, 1 << f);
      const { keys, size } = shared;
      const histogram = new Int32Array(size);
      const others = ~(1 << f) & 0xff;
      if (active === 0) {
        for (let i = 0; i < length; i++) {
          const key = keys[slots[i]];
          if (key >= 0) histogram[key]++;
        }
      } else {
        for (let i = 0; i < length; i++) {
          if ((fail[i] & others) !== 0) continue;
          const key = keys[slots[i]];
          if (key >= 0) histogram[key]++;
        }
      }
      return column.countsFrom(histogram);
    });
  }

  /** Bucket lists: most frequent first (ties by value), at most FACET_LIST_LIMIT, plus every selected value. */
  buckets(counts: Int32Array[], selection: FacetSelection): Record<FacetName, FacetBucket[]> {
    const out = {} as Record<FacetName, FacetBucket[]>;
    FACET_NAMES.forEach((name, f) => {
      const column = this.ordered[f];
      const chosen = new Set(selection[name] ?? []);
      const listed = column.topCodes(counts[f], FACET_LIST_LIMIT);
      for (const value of chosen) {
        const code = column.lookup(value);
        if (code !== undefined && !listed.includes(code)) listed.push(code);
      }
      out[name] = listed.map((code) => bucket(column, code, counts[f][code], chosen.has(column.values[code])));
      // A selected value the index has never seen still shows, with 0, so the visitor can remove it.
      for (const value of chosen) {
        if (column.lookup(value) === undefined) out[name].push({ value, count: 0, selected: true });
      }
    });
    return out;
  }
}

/** Keeps (in order, at the front) the slots with at most one failure bit; returns how many. */
function dropDoubleFailures(slots: Int32Array, fail: Uint8Array, length: number): number {
  let kept = 0;
  for (let i = 0; i < length; i++) {
    const bits = fail[i];
    if ((bits & (bits - 1)) !== 0) continue;
    slots[kept] = slots[i];
    fail[kept++] = bits;
  }
  return kept;
}

function bucket(column: FacetColumn, code: number, count: number, selected: boolean): FacetBucket {
  const b: FacetBucket = { value: column.values[code], count };
  if (column.labels[code] !== undefined) b.label = column.labels[code];
  if (selected) b.selected = true;
  return b;
}
