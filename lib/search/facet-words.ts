// Words of the small-vocabulary fields (quantities, methods, excitation, group) are matched against the facet
// dictionaries instead of being indexed per version in FlexSearch: in the benchmark corpus a version carries ~9 such
// words (14 % of all postings) from a vocabulary of a few dozen. A matching word costs one scan of a facet column,
// and the scan is reused until the index next changes.
import type { FacetColumn } from './facet-column';
import type { FacetColumns } from './facets';
import { textKeys } from './tokenise';
import type { FacetName } from './types';

const WORDY_FACETS: FacetName[] = ['quantity', 'method', 'excitation', 'group'];

type Vocabulary = { size: number; codesOf: Map<string, number[]> };

// Slot lists of recently matched facet words, kept until the index changes (bounded to 2 M slot numbers, ~16 MB as plain arrays).
const CACHE_SLOTS = 2_000_000;

export class FacetWords {
  private readonly vocabularies = new Map<FacetName, Vocabulary>();
  private scratch = new Int32Array(0);
  private readonly cache = new Map<string, number[]>();
  private cachedSlots = 0;
  private cachedAt = -1;

  constructor(private readonly facets: FacetColumns) {}

  /**
   * The slots (below `upTo`) whose quantity, method, excitation or group has `term` among its words, one list per
   * facet; with `only`, just the slots set in it (the latest versions: a third fewer to read in the benchmark corpus).
   * `changes` is the index's change counter, bumped by every change to the facets or to `only`: lists found since the
   * last change are reused.
   */
  slotsFor(term: string, upTo: number, changes: number, only?: Uint8Array): number[][] {
    if (changes !== this.cachedAt) {
      this.cache.clear();
      this.cachedSlots = 0;
      this.cachedAt = changes;
    }
    const found: number[][] = [];
    for (const name of WORDY_FACETS) {
      const column = this.facets.columns[name];
      const codes = this.vocabulary(name, column).codesOf.get(term);
      if (!codes) continue;
      const key = `${name}:${term}${only ? ':only' : ''}`;
      let slots = this.cache.get(key);
      if (!slots) {
        const flags = new Uint8Array(column.values.length);
        for (const code of codes) flags[code] = 1;
        if (this.scratch.length < upTo) this.scratch = new Int32Array(upTo);
        let length = column.slotsWith(flags, upTo, this.scratch);
        if (only) length = keepSet(this.scratch, length, only);
        slots = Array.from(this.scratch.subarray(0, length)); // plain, like FlexSearch's postings (text-match.ts)
        if (this.cachedSlots + slots.length > CACHE_SLOTS) {
          this.cache.clear();
          this.cachedSlots = 0;
        }
        this.cache.set(key, slots);
        this.cachedSlots += slots.length;
      }
      if (slots.length) found.push(slots);
    }
    return found;
  }

  // Rebuilt only when the facet has gained values (values are never renamed, only added).
  private vocabulary(name: FacetName, column: FacetColumn): Vocabulary {
    let vocabulary = this.vocabularies.get(name);
    if (!vocabulary || vocabulary.size !== column.values.length) {
      const codesOf = new Map<string, number[]>();
      column.values.forEach((value, code) => {
        for (const key of new Set(textKeys(`${value} ${column.labels[code] ?? ''}`))) {
          const list = codesOf.get(key) ?? [];
          list.push(code);
          codesOf.set(key, list);
        }
      });
      vocabulary = { size: column.values.length, codesOf };
      this.vocabularies.set(name, vocabulary);
    }
    return vocabulary;
  }
}

/** Keeps (in order, at the front) the slots set in `only`; returns how many. */
function keepSet(slots: Int32Array, length: number, only: Uint8Array): number {
  let kept = 0;
  for (let i = 0; i < length; i++) if (only[slots[i]] === 1) slots[kept++] = slots[i];
  return kept;
}
