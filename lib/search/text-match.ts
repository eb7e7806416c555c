// The full-text part: a FlexSearch Document over the searchable fields, keyed by slot number, and the AND-of-terms
// matching with field-weighted scores. FlexSearch only answers "which slots contain this key in this field".
import { Document } from 'flexsearch';
import { elementKeys } from './normalise-formula';
import { addNewKeys, spaceKeys } from './tokenise';
import type { SearchDoc } from './types';

// Three FlexSearch fields keep the build fast (each field costs a pass per version): the title; a "head" of the short
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

type TextFields = { id: number; title: string; head: string; body: string };

/**
 * The text FlexSearch indexes for one version; every field is pre-keyed (space-separated keys from tokenise.ts).
 * A key is indexed once, in the first field that has it (title, then head, then body): the version is found all the
 * same and scores that field's weight, with fewer postings to build and keep.
 */
export function textFields(slot: number, doc: SearchDoc, keysOfMaterial: readonly string[]): TextFields {
  const seen = new Set<string>();
  const title: string[] = [];
  addNewKeys(doc.title, seen, title);
  // Quantities, methods, excitation and group are matched through the facet dictionaries instead (facet-words.ts).
  const head: string[] = [];
  for (const key of keysOfMaterial) addKey(key, seen, head);
  for (const element of elementKeys(doc.formula)) addKey(element, seen, head);
  addNewKeys(doc.material, seen, head);
  for (const keyword of doc.keywords) addNewKeys(keyword, seen, head);
  for (const creator of doc.creators) addNewKeys(creator, seen, head);
  const body: string[] = [];
  addNewKeys(doc.description, seen, body);
  return { id: slot, title: title.join(' '), head: head.join(' '), body: body.join(' ') };
}

function addKey(key: string, seen: Set<string>, out: string[]): void {
  if (seen.has(key)) return;
  seen.add(key);
  out.push(key);
}

export class TextMatcher {
  // Strict (whole-word) tokens and no fast-update register: forward tokens cost 3× the build time and 2.5× the memory,
  // and the register +50 % memory; a removal scans the index instead (≈100 ms at 100 k versions, outbox events are rare).
  private readonly index = new Document<TextFields>({
    document: { id: 'id', index: FIELDS.map(({ field }) => ({ field, tokenize: 'strict' as const, resolution: RESOLUTION, encode: spaceKeys })) },
  });
  private score = new Float64Array(0);
  private stamp = new Uint32Array(0);
  private seen = new Uint8Array(0);
  private found = new Int32Array(0);
  private gen = 0;
  private length = 0;

  grow(capacity: number): void {
    const score = new Float64Array(capacity);
    const stamp = new Uint32Array(capacity);
    const seen = new Uint8Array(capacity);
    stamp.set(this.stamp);
    this.score = score;
    this.stamp = stamp;
    this.seen = seen;
    this.found = new Int32Array(capacity);
  }

  add(fields: TextFields): void {
    this.index.add(fields);
  }

  remove(slot: number): void {
    this.index.remove(slot);
  }

  /**
   * Slots containing every term (each term in any field), written to the front of the returned buffer, with scores:
   * per term and field, weight × (1 − ½·bucket/9), where bucket is FlexSearch's position score (0 = the field's first
   * words). Equal buckets give equal scores, so ties fall to the date order. Buffer and scores are reused by the next call.
   */
  match(terms: readonly string[], more?: (term: string) => Int32Array[]): { slots: Int32Array; length: number; score: Float64Array } {
    this.gen++;
    this.length = 0;
    for (let t = 0; t < terms.length; t++) {
      for (const { field, weight } of FIELDS) {
        // resolve: false hands back FlexSearch's own bucket arrays (no copy, no limit); they are only read here.
        const buckets = this.index.search(terms[t], { index: field, resolve: false }).result as (number[] | undefined)[];
        for (let b = 0; b < buckets.length; b++) {
          const ids = buckets[b];
          if (ids) this.visitArray(ids, t, weight * (1 - (0.5 * b) / RESOLUTION));
        }
      }
      // Facet words (quantities, methods, group) count like a word in the middle of the head field.
      for (const ids of more?.(terms[t]) ?? []) this.visitTyped(ids, t, FACET_WORD_GAIN);
    }
    const { seen, found } = this;
    let kept = 0;
    for (let i = 0; i < this.length; i++) if (seen[found[i]] === terms.length) found[kept++] = found[i];
    return { slots: found, length: kept, score: this.score };
  }

  // Two copies of one loop, so each stays monomorphic (plain arrays from FlexSearch, Int32Arrays from facet words).
  private visitArray(ids: number[], t: number, gain: number): void {
    const { stamp, seen, score, found, gen } = this;
    let length = this.length;
    for (let r = 0; r < ids.length; r++) {
      const s = ids[r];
      if (stamp[s] !== gen) {
        if (t > 0) continue; // missed an earlier term
        stamp[s] = gen;
        seen[s] = 1;
        score[s] = gain;
        found[length++] = s;
      } else if (seen[s] >= t) {
        seen[s] = t + 1;
        score[s] += gain;
      }
    }
    this.length = length;
  }

  private visitTyped(ids: Int32Array, t: number, gain: number): void {
    const { stamp, seen, score, found, gen } = this;
    let length = this.length;
    for (let r = 0; r < ids.length; r++) {
      const s = ids[r];
      if (stamp[s] !== gen) {
        if (t > 0) continue;
        stamp[s] = gen;
        seen[s] = 1;
        score[s] = gain;
        found[length++] = s;
      } else if (seen[s] >= t) {
        seen[s] = t + 1;
        score[s] += gain;
      }
    }
    this.length = length;
  }
}
