// The full-text part: one FlexSearch Index per searchable field, keyed by slot number, and the AND-of-terms matching
// with field-weighted scores. FlexSearch only answers "which slots contain this key in this field".
import { Index } from 'flexsearch';
import { elementKeys } from './normalise-formula';
import { makeKeyNumbering, type VersionText } from './key-numbering';
import { addKeys, spaceKeys } from './tokenise';
import type { SearchDoc } from './types';

// Three fields keep the build fast (each field costs a pass per version): the title; a "head" of the short
// descriptive fields in falling order of importance (formula keys, elements, material name, keywords, creators), so
// FlexSearch's position score ranks a formula above an element it contains; and the description.
// Weight: relative value of a match in the field.
const FIELDS = [
  { field: 'title', weight: 3 },
  { field: 'head', weight: 2 },
  { field: 'body', weight: 1 },
] as const;
// FlexSearch's default resolution: positions in a field fall into 9 score buckets.
const RESOLUTION = 9;
const FACET_WORD_GAIN = 2 * (1 - (0.5 * 4) / RESOLUTION);

type TextField = (typeof FIELDS)[number]['field'];

/** The keys of one version per field, in order (each key in one field only): what FlexSearch indexes. */
export type TextFields = { title: string[]; head: string[]; body: string[] };

// One copy of every key ever indexed, with a number (key-numbering.ts). FlexSearch files each posting under its key in
// a plain object and a Map: handing it the same string object every time (already hashed, already known to the engine)
// makes adding ~40 % cheaper than fresh strings from the tokeniser. A speed aid only: starting afresh changes no result.
const VOCABULARY_LIMIT = 4_000_000;

/** The text of a version as key-numbering.ts reads it (keysOfMaterial: formula keys and aliases, normalise-formula.ts). */
export function versionText(doc: SearchDoc, keysOfMaterial: readonly string[]): VersionText {
  // Quantities, methods, excitation and group are matched through the facet dictionaries instead (facet-words.ts).
  return {
    title: doc.title,
    preKeyed: [...keysOfMaterial, ...elementKeys(doc.formula)],
    texts: [doc.material, ...doc.keywords, ...doc.creators],
    body: doc.description,
  };
}

/** The fields at `ids[at]` onwards as numbered by KeyNumbering.number, as keys; returns them and where the next begin. */
export function fieldsAt(ids: ArrayLike<number>, at: number, keyOf: (id: number) => string): { fields: TextFields; next: number } {
  const field = (): string[] => {
    const n = ids[at++];
    const keys = new Array<string>(n);
    for (let i = 0; i < n; i++) keys[i] = keyOf(ids[at++]);
    return keys;
  };
  const title = field();
  const head = field();
  const body = field();
  return { fields: { title, head, body }, next: at };
}

export class FieldKeys {
  private numbering = makeKeyNumbering(addKeys);
  private readonly ids: number[] = [];

  /**
   * The keys FlexSearch indexes for one version (keys from tokenise.ts), each in the first field that has it: title,
   * then head (formula keys, elements, material name, keywords, creators: FlexSearch's position score ranks a formula
   * above an element it contains), then body (the description).
   */
  fields(doc: SearchDoc, keysOfMaterial: readonly string[]): TextFields {
    if (this.numbering.size() > VOCABULARY_LIMIT) this.numbering = makeKeyNumbering(addKeys);
    this.ids.length = 0;
    this.numbering.number(versionText(doc, keysOfMaterial), this.ids);
    return fieldsAt(this.ids, 0, this.numbering.keyOf).fields;
  }

  /** Number of distinct keys remembered. */
  get size(): number {
    return this.numbering.size();
  }
}

/**
 * A field's FlexSearch index. Content is handed over already keyed: add() passes the key array itself (no join and
 * split, and the keys keep their computed hashes); a query string is split at spaces like any keyed text.
 */
export function fieldIndex(): Index {
  return new Index({ tokenize: 'strict', resolution: RESOLUTION, encode: (content: string | string[]) => (typeof content === 'string' ? spaceKeys(content) : content) });
}

/** FlexSearch's add() is typed for text; our field encoder takes the key array as it is (fieldIndex). */
export function addKeyed(index: Index, slot: number, keys: string[]): void {
  if (keys.length) index.add(slot, keys as unknown as string);
}

export class TextMatcher {
  // Strict (whole-word) tokens and no fast-update register: forward tokens cost 3× the build time and 2.5× the memory,
  // and the register +50 % memory; a removal scans the index instead (≈100 ms at 100 k versions, outbox events are rare).
  private readonly indexes: Record<TextField, Index> = { title: fieldIndex(), head: fieldIndex(), body: fieldIndex() };
  private readonly keys = new FieldKeys();
  private score = new Float64Array(0);
  // Per slot, generation << 4 | how many terms of the current query it has matched (at most MAX_QUERY_TERMS = 12;
  // generations wrap below 2^27, so a mark stays a positive int32): one read tells whether a slot is still in the running.
  private mark = new Uint32Array(0);
  private found = new Int32Array(0);
  private gen = 0;
  private length = 0;

  grow(capacity: number): void {
    this.score = new Float64Array(capacity);
    this.mark = new Uint32Array(capacity);
    this.gen = 0;
    this.found = new Int32Array(capacity);
  }

  /** Indexes the version's text (keysOfMaterial: formula keys and aliases, normalise-formula.ts). */
  add(slot: number, doc: SearchDoc, keysOfMaterial: readonly string[]): void {
    this.addKeys(slot, this.keys.fields(doc, keysOfMaterial));
  }

  /** Indexes a slot's keys, numbered elsewhere (SearchIndex.addAll): add() without the keying. */
  addKeys(slot: number, fields: TextFields): void {
    for (const { field } of FIELDS) addKeyed(this.indexes[field], slot, fields[field]);
  }

  remove(slot: number): void {
    for (const { field } of FIELDS) this.indexes[field].remove(slot);
  }

  /**
   * Slots containing every term (each term in any field), written to the front of the returned buffer, with scores:
   * per term and field, weight × (1 − ½·bucket/9), where bucket is FlexSearch's position score (0 = the field's first
   * words). Equal buckets give equal scores, so ties fall to the date order. `only`: a 0/1 column the slots must have
   * set (the latest versions). Buffer and scores are reused by the next call.
   */
  match(
    terms: readonly string[],
    more?: (term: string) => readonly number[][],
    only?: Uint8Array,
  ): { slots: Int32Array; length: number; score: Float64Array } {
    if (++this.gen === 1 << 27) {
      this.mark.fill(0);
      this.gen = 1;
    }
    this.length = 0;
    for (let t = 0; t < terms.length; t++) {
      for (const { field, weight } of FIELDS) {
        // resolve: false hands back FlexSearch's own bucket arrays (no copy, no limit); they are only read here.
        const buckets = this.indexes[field].search(terms[t], { resolve: false }).result as (number[] | undefined)[];
        for (let b = 0; b < buckets.length; b++) {
          const ids = buckets[b];
          if (!ids) continue;
          const gain = weight * (1 - (0.5 * b) / RESOLUTION);
          if (t === 0) this.firstArray(ids, gain, only);
          else this.nextArray(ids, t, gain);
        }
      }
      // Facet words (quantities, methods, group) count like a word in the middle of the head field.
      for (const ids of more?.(terms[t]) ?? []) {
        if (t === 0) this.firstArray(ids, FACET_WORD_GAIN, only);
        else this.nextArray(ids, t, FACET_WORD_GAIN);
      }
    }
    const { mark, found } = this;
    if (terms.length === 1) return { slots: found, length: this.length, score: this.score }; // every slot found has it
    const all = (this.gen << 4) | terms.length;
    let kept = 0;
    for (let i = 0; i < this.length; i++) if (mark[found[i]] === all) found[kept++] = found[i];
    return { slots: found, length: kept, score: this.score };
  }

  // The first term's slots join (those `only` allows; met again in another field or bucket, they gain again); a later
  // term's slots count only if they have every earlier term. FlexSearch's postings and the facet words' lists are both
  // plain arrays, so each loop sees one array kind.
  private firstArray(ids: number[], gain: number, only: Uint8Array | undefined): void {
    const { mark, score, found } = this;
    const one = (this.gen << 4) | 1;
    let length = this.length;
    for (let r = 0; r < ids.length; r++) {
      const s = ids[r];
      if (mark[s] === one) score[s] += gain;
      else if (!only || only[s] === 1) {
        mark[s] = one;
        score[s] = gain;
        found[length++] = s;
      }
    }
    this.length = length;
  }

  // Without a branch: whether a posting's slot is still in the running changes at random from one posting to the next,
  // and the mispredicted branch cost more than writing every posting's mark and score back (≈ 10 % of a two-term query).
  private nextArray(ids: number[], t: number, gain: number): void {
    const { mark, score } = this;
    const before = (this.gen << 4) | t; // has terms 0 … t − 1
    const after = before + 1; // has term t too
    for (let r = 0; r < ids.length; r++) {
      const s = ids[r];
      const m = mark[s];
      const running = +((m - before) >>> 0 < 2); // m is before or after
      mark[s] = m + running * (after - m);
      score[s] += running * gain;
    }
  }
}
