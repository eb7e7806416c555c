// Slot bookkeeping for the search index: version id ↔ slot number, the stored card fields, and the per-slot columns
// every query reads (live, latest, publication time). Slots of removed versions are reused.
import { TextArena } from './text-arena';
import type { NumericRange, SearchDoc } from './types';

/** What the index keeps of a SearchDoc as an object; the rest lives in columns (ranges, sparkline, span, flags, date)
 * and in the text arena (title, description, DOI, dataset id). */
export type StoredDoc = Omit<
  SearchDoc,
  'ranges' | 'sparkline' | 'temperatureSpanK' | 'isLatest' | 'publishedAt' | 'title' | 'description' | 'doi' | 'datasetId'
>;

// Fields of the text arena, in order.
const TITLE = 0, DESCRIPTION = 1, DOI = 2, DATASET = 3;

const INITIAL_CAPACITY = 1024;
// Columns grow by a quarter: little idle memory; a rebuild that knows its row count reserves it up front.
const GROWTH = 1.25;

export class SlotTable {
  readonly docs: (StoredDoc | undefined)[] = [];
  live = new Uint8Array(0);
  latest = new Uint8Array(0);
  dateMs = new Float64Array(0);
  private span = new Float64Array(0); // temperatureSpanK as [lo, hi] per slot, NaN when absent
  private markStamp = new Uint32Array(0);
  private markGeneration = 0;
  private readonly slots = new Map<string, number>();
  private readonly free: number[] = [];
  private next = 0;
  // Facet-like strings repeat across versions (groups, creators, quantities); one copy each keeps memory flat.
  private readonly strings = new Map<string, string>();
  private readonly groups = new Map<string, SearchDoc['group']>();
  private readonly lists = new Map<string, string[]>();
  private readonly text = new TextArena(4);

  /** Makes room for `count` slots at once (a rebuild knows how many versions it will add). */
  reserve(count: number): void {
    if (count > this.capacity) this.grow(count);
  }

  get size(): number {
    return this.slots.size;
  }

  get capacity(): number {
    return this.live.length;
  }

  slotOf(versionId: string): number | undefined {
    return this.slots.get(versionId);
  }

  /** A free slot; grows the columns by a quarter when full. */
  allocate(): number {
    const reused = this.free.pop();
    if (reused !== undefined) return reused;
    if (this.next === this.capacity) this.grow(Math.max(INITIAL_CAPACITY, Math.ceil(this.capacity * GROWTH)));
    return this.next++;
  }

  release(slot: number): void {
    const doc = this.docs[slot];
    if (doc) this.slots.delete(doc.versionId);
    this.docs[slot] = undefined;
    this.text.clear(slot);
    this.live[slot] = 0;
    this.latest[slot] = 0;
    this.free.push(slot);
  }

  /**
   * Keeps the version's card fields. Lists and the group object are frozen: equal ones are shared between versions
   * and handed out as they are by toSearchDoc, so a caller that tried to change one would throw instead of altering
   * other versions' cards.
   */
  store(slot: number, doc: SearchDoc): void {
    const s = (v: string) => this.intern(v);
    let group = this.groups.get(doc.group.slug);
    if (!group || group.name !== doc.group.name) this.groups.set(doc.group.slug, (group = Object.freeze({ slug: s(doc.group.slug), name: s(doc.group.name) })));
    this.text.set(slot, [doc.title, doc.description, doc.doi, doc.datasetId]);
    this.docs[slot] = {
      versionId: doc.versionId,
      versionNumber: doc.versionNumber,
      keywords: Object.freeze(doc.keywords.map(s)) as string[],
      material: s(doc.material),
      formula: s(doc.formula),
      creators: Object.freeze(doc.creators.map(s)) as string[],
      group,
      quantities: this.internList(doc.quantities),
      methods: this.internList(doc.methods),
      excitation: doc.excitation,
      year: doc.year,
      embargoed: doc.embargoed,
    };
    this.slots.set(doc.versionId, slot);
    this.live[slot] = 1;
    this.latest[slot] = doc.isLatest ? 1 : 0;
    const ms = Date.parse(doc.publishedAt);
    this.dateMs[slot] = Number.isFinite(ms) ? ms : 0;
    const span = doc.temperatureSpanK;
    this.span[2 * slot] = span ? span[0] : NaN;
    this.span[2 * slot + 1] = span ? span[1] : NaN;
  }

  /** Whether `doc` has the same searchable text as the stored version (then only its columns need updating). */
  sameText(slot: number, doc: SearchDoc): boolean {
    const old = this.docs[slot];
    if (!old) return false;
    const list = (a: string[], b: string[]) => a.length === b.length && a.every((v, i) => v === b[i]);
    return this.title(slot) === doc.title && this.description(slot) === doc.description && old.material === doc.material &&
      old.formula === doc.formula && old.excitation === doc.excitation && old.group.slug === doc.group.slug &&
      old.group.name === doc.group.name && list(old.keywords, doc.keywords) && list(old.creators, doc.creators) &&
      list(old.quantities, doc.quantities) && list(old.methods, doc.methods);
  }

  /** Every live slot (or every latest one), written to the front of `into`. */
  liveSlots(into: Int32Array, latestOnly: boolean): { slots: Int32Array; length: number; score?: Float64Array } {
    const wanted = latestOnly ? this.latest : this.live; // latest implies live: release() clears both
    let length = 0;
    for (let s = 0; s < this.next; s++) if (wanted[s] === 1) into[length++] = s;
    return { slots: into, length };
  }

  /** A membership test for `slots[0..length)`, valid until the next call. */
  mark(slots: Int32Array, length: number): (slot: number) => boolean {
    const gen = ++this.markGeneration;
    const stamp = this.markStamp;
    for (let i = 0; i < length; i++) stamp[slots[i]] = gen;
    return (slot) => stamp[slot] === gen;
  }

  /** The stored version as a SearchDoc. Its lists and group are the stored ones, shared and frozen (see store()). */
  toSearchDoc(slot: number, ranges: SearchDoc['ranges'], sparkline: [number, number][] | undefined): SearchDoc {
    const d = this.docs[slot] as StoredDoc;
    const doc: SearchDoc = {
      versionId: d.versionId, datasetId: this.text.get(slot, DATASET), versionNumber: d.versionNumber,
      isLatest: this.latest[slot] === 1, title: this.title(slot), description: this.description(slot),
      keywords: d.keywords, material: d.material, formula: d.formula,
      creators: d.creators, group: d.group, quantities: d.quantities, methods: d.methods, excitation: d.excitation,
      year: d.year, publishedAt: new Date(this.dateMs[slot]).toISOString(), embargoed: d.embargoed,
      doi: this.text.getOrNull(slot, DOI), ranges,
    };
    if (sparkline) doc.sparkline = sparkline;
    if (!Number.isNaN(this.span[2 * slot])) doc.temperatureSpanK = [this.span[2 * slot], this.span[2 * slot + 1]] as NumericRange;
    return doc;
  }

  title(slot: number): string {
    return this.text.get(slot, TITLE);
  }

  description(slot: number): string {
    return this.text.get(slot, DESCRIPTION);
  }

  // Quantity and method lists come from a small vocabulary and repeat as a whole; equal lists share one array.
  private internList(values: readonly string[]): string[] {
    const key = values.join('\u0001');
    const known = this.lists.get(key);
    if (known) return known;
    const list = Object.freeze(values.map((v) => this.intern(v))) as string[];
    this.lists.set(key, list);
    return list;
  }

  private intern(value: string): string {
    const known = this.strings.get(value);
    if (known !== undefined) return known;
    this.strings.set(value, value);
    return value;
  }

  private grow(capacity: number): void {
    const copy = <T extends Uint8Array | Float64Array | Uint32Array>(old: T, next: T) => (next.set(old as never), next);
    this.live = copy(this.live, new Uint8Array(capacity));
    this.latest = copy(this.latest, new Uint8Array(capacity));
    this.dateMs = copy(this.dateMs, new Float64Array(capacity));
    this.span = copy(this.span, new Float64Array(capacity * 2).fill(NaN));
    this.markStamp = copy(this.markStamp, new Uint32Array(capacity));
    this.text.grow(capacity);
  }
}
