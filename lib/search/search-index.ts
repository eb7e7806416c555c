// The in-process search index of published versions: FlexSearch for words, our own columns for facets, ranges,
// order and cards. Pure (no DB, Next or React): the caller feeds it from the database and the outbox.
import { FacetWords } from './facet-words';
import { facetSelection, FacetColumns, facetValue, selectsAnything } from './facets';
import { highlightSegments, SNIPPET_CHARS } from './highlight';
import { formulaKey, materialKeys } from './normalise-formula';
import type { SlotKeys } from './ordering';
import { DEFAULT_PAGE_SIZE, validateSearchQuery } from './parse-query';
import { queryTerms } from './query-terms';
import { RangeColumns } from './ranges';
import { ResultPages } from './result-pages';
import { SparklineStore } from './sparkline-store';
import { SlotTable, type StoredDoc } from './slot-table';
import type { VersionText } from './key-numbering';
import type { KeyNumberer, NumberedBatch } from './key-worker';
import { fieldsAt, TextMatcher, versionText } from './text-match';
import { type SearchDoc, type SearchHit, type SearchQuery, type SearchResult } from './types';

// Versions per batch in addAll: the worker numbers one batch while this thread indexes the one before.
const ADD_CHUNK = 400;

export class SearchIndex {
  private readonly table = new SlotTable();
  private readonly facets = new FacetColumns(0);
  private readonly ranges = new RangeColumns(0);
  private readonly sparklines = new SparklineStore(0);
  private readonly text = new TextMatcher();
  private readonly facetWords = new FacetWords(this.facets);
  private readonly formulas = new Map<string, number>(); // formula key or alias → versions carrying it
  private readonly keys: SlotKeys = { dateMs: this.table.dateMs, versionIdOf: (s) => this.table.docs[s]?.versionId ?? '' };
  private readonly pages = new ResultPages(this.table, this.keys);
  private buffer = new Int32Array(0);
  private changes = 0; // bumped by every add and remove; keys the cached counts of the plain listing
  private readonly unfiltered = new Map<boolean, { changes: number; passed: number; counts: Int32Array[] }>();
  private readonly live = new Map<boolean, { changes: number; slots: Int32Array }>(); // every (latest) slot, in order

  /** `capacity`: the number of versions about to be added, if known (a rebuild counts its rows), to size columns once. */
  constructor(options: { capacity?: number } = {}) {
    if (options.capacity) {
      this.table.reserve(options.capacity);
      this.growTo(this.table.capacity);
    }
  }

  /** Number of indexed versions. */
  get size(): number {
    return this.table.size;
  }

  has(versionId: string): boolean {
    return this.table.slotOf(versionId) !== undefined;
  }

  /** The indexed version as a SearchDoc (sparkline at stored resolution), or undefined. */
  get(versionId: string): SearchDoc | undefined {
    const slot = this.table.slotOf(versionId);
    return slot === undefined ? undefined : this.toSearchDoc(slot);
  }

  /** Adds a version, or replaces it if already indexed (text is re-indexed only when searchable text changed). */
  add(doc: SearchDoc): void {
    const keysOfMaterial = materialKeys(doc.material, doc.formula);
    const existing = this.table.slotOf(doc.versionId);
    if (existing !== undefined) {
      const sameText = this.table.sameText(existing, doc);
      this.unindexColumns(existing);
      if (!sameText) this.text.remove(existing);
      this.indexColumns(existing, doc, keysOfMaterial);
      if (!sameText) this.text.add(existing, doc, keysOfMaterial);
      return;
    }
    const slot = this.columnsOfNew(doc, keysOfMaterial);
    this.text.add(slot, doc, keysOfMaterial);
  }

  // A slot for a version not indexed yet (the columns grown if full), with its columns filled; its text is the caller's.
  private columnsOfNew(doc: SearchDoc, keysOfMaterial: readonly string[]): number {
    const slot = this.table.allocate();
    if (this.table.capacity > this.buffer.length) this.growTo(this.table.capacity);
    this.indexColumns(slot, doc, keysOfMaterial);
    return slot;
  }

  /**
   * Adds many versions (a rebuild), with the same result as add() for each in turn; query the index once it resolves.
   * With `keyer` (key-worker.ts) each version's columns are filled at once and its text sent to the worker, which
   * numbers the keys of one batch of ADD_CHUNK while this thread fills the columns of the next; the keys go into
   * FlexSearch as their batch comes back. Only slot numbers wait, so docs die young. Without a worker, or once it
   * fails, the rest are added one by one here. Returns how many versions the worker keyed.
   */
  async addAll(docs: Iterable<SearchDoc>, keyer?: KeyNumberer | null): Promise<{ keyedByWorker: number }> {
    let keyedByWorker = 0;
    const keyOf: string[] = []; // the worker's key numbers, one string object per key (text-match.ts says why)
    const waiting: { slots: number[]; numbered: Promise<NumberedBatch> | null }[] = [];
    let batch: { slots: number[]; texts: VersionText[] } = { slots: [], texts: [] };
    // Indexes the text of the oldest batch sent, from the worker's numbers or, if it failed, on this thread from the
    // stored versions.
    const indexOldest = async () => {
      const { slots, numbered } = waiting.shift()!;
      const result = numbered && (await numbered.catch(() => null));
      if (!result) {
        keyer = null;
        for (const slot of slots) {
          const doc = this.toSearchDoc(slot);
          this.text.add(slot, doc, materialKeys(doc.material, doc.formula));
        }
        return;
      }
      for (const key of result.keys) keyOf.push(key);
      keyedByWorker += slots.length;
      let at = 0;
      for (const slot of slots) {
        const { fields, next } = fieldsAt(result.ids, at, (id) => keyOf[id]);
        this.text.addKeys(slot, fields);
        at = next;
      }
    };
    const send = () => {
      if (!batch.slots.length) return;
      const numbered = keyer ? keyer.number(batch.texts) : null; // the worker gets a copy: the texts die young here
      numbered?.catch(() => undefined); // a failure is handled where the batch is indexed
      waiting.push({ slots: batch.slots, numbered });
      batch = { slots: [], texts: [] };
    };
    for (const doc of docs) {
      if (!keyer && !waiting.length && !batch.slots.length) {
        this.add(doc);
        continue;
      }
      if (this.table.slotOf(doc.versionId) !== undefined) {
        // A replacement, or a version given twice: every text sent before it goes in first, then the usual way.
        send();
        while (waiting.length) await indexOldest();
        this.add(doc);
        continue;
      }
      const keysOfMaterial = materialKeys(doc.material, doc.formula);
      const slot = this.columnsOfNew(doc, keysOfMaterial);
      batch.slots.push(slot);
      batch.texts.push(versionText(doc, keysOfMaterial));
      if (batch.slots.length === ADD_CHUNK) {
        send();
        if (waiting.length > 1) await indexOldest(); // one batch stays with the worker while the next fills
      }
    }
    send();
    while (waiting.length) await indexOldest();
    return { keyedByWorker };
  }

  /** Same as add: the outbox says "this version changed", whatever changed. */
  update(doc: SearchDoc): void {
    this.add(doc);
  }

  /** Removes a version (withdrawn, or no longer public); false when it was not indexed. */
  remove(versionId: string): boolean {
    const slot = this.table.slotOf(versionId);
    if (slot === undefined) return false;
    this.unindexColumns(slot);
    this.text.remove(slot);
    this.table.release(slot);
    return true;
  }

  /** Runs a query; throws only SearchQueryError (HTTP 400) for parameters that break the schema or a range. */
  search(params: SearchQuery): SearchResult {
    const query = validateSearchQuery(params);
    const { terms, notes } = queryTerms(query.q, (key) => this.formulas.has(key));
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? DEFAULT_PAGE_SIZE;
    const sort = terms.length === 0 ? 'date' : (query.sort ?? 'relevance');

    const latestOnly = !query.allVersions;
    const ranged = this.ranges.filters(query);
    const selection = facetSelection(query);
    const offset = (page - 1) * pageSize;
    let pageSlots: number[] = [];
    let passed: number;
    let counts: Int32Array[];
    let score: Float64Array | undefined;
    if (!terms.length && !ranged && !selectsAnything(selection)) {
      // The plain listing (no text, no filter): counts cached until the next change, page read off the date order.
      ({ passed, counts } = this.unfilteredCounts(latestOnly));
      if (offset < passed) pageSlots = this.pages.newestOfAll(latestOnly, offset, pageSize);
    } else {
      // Words (or every version), then latest-only and ranges, then facets with their counts.
      const found = this.candidates(terms, latestOnly, ranged ? query : null);
      const slots = found.slots;
      score = found.score;
      ({ passed, counts } = this.facets.filterAndCount(slots, found.length, selection));
      if (offset < passed) {
        pageSlots = sort === 'relevance' && score
          ? this.pages.byScore(slots, passed, offset, pageSize, score)
          : this.pages.newestOf(slots, passed, offset, pageSize);
      }
    }
    const termSet = new Set(terms);
    const hits: SearchHit[] = pageSlots.map((s) => this.hit(s, termSet, terms.length && score ? score[s] : 0));
    return { total: passed, page, pageSize, sort, hits, facets: this.facets.buckets(counts, selection), notes };
  }

  /** Slots matching every term (or all live ones), narrowed to latest versions and the range filters. */
  private candidates(terms: string[], latestOnly: boolean, ranges: SearchQuery | null) {
    const only = latestOnly ? this.table.latest : undefined;
    const found = terms.length
      ? this.text.match(terms, (term) => this.facetWords.slotsFor(term, this.table.capacity, this.changes, only), only)
      : this.everySlot(latestOnly);
    let { length } = found;
    if (ranges) length = this.ranges.narrow(ranges, found.slots, length);
    return { slots: found.slots, length, score: found.score };
  }

  private hit(slot: number, terms: ReadonlySet<string>, score: number): SearchHit {
    const doc = this.toSearchDoc(slot);
    const highlights: SearchHit['highlights'] = {};
    const title = highlightSegments(doc.title, terms);
    const description = highlightSegments(doc.description, terms, SNIPPET_CHARS);
    if (title) highlights.title = title;
    if (description) highlights.description = description;
    return { doc, score: Math.round(score * 1000) / 1000, highlights };
  }

  /** Every live (or latest) slot, copied to the front of the shared buffer from a list kept until the next change. */
  private everySlot(latestOnly: boolean): { slots: Int32Array; length: number; score?: Float64Array } {
    let cached = this.live.get(latestOnly);
    if (!cached || cached.changes !== this.changes) {
      const { slots, length } = this.table.liveSlots(this.buffer, latestOnly);
      this.live.set(latestOnly, (cached = { changes: this.changes, slots: slots.slice(0, length) }));
    }
    this.buffer.set(cached.slots);
    return { slots: this.buffer, length: cached.slots.length };
  }

  private unfilteredCounts(latestOnly: boolean): { passed: number; counts: Int32Array[] } {
    const cached = this.unfiltered.get(latestOnly);
    if (cached && cached.changes === this.changes) return cached;
    const { slots, length } = this.everySlot(latestOnly);
    const fresh = { changes: this.changes, ...this.facets.filterAndCount(slots, length, {}) };
    this.unfiltered.set(latestOnly, fresh);
    return fresh;
  }

  private indexColumns(slot: number, doc: SearchDoc, keysOfMaterial: readonly string[]): void {
    this.changes++;
    this.table.store(slot, doc);
    const c = this.facets.columns;
    c.material.setOne(slot, formulaKey(doc.formula) || formulaKey(doc.material), doc.formula || doc.material);
    c.quantity.setMany(slot, doc.quantities.map(facetValue));
    c.method.setMany(slot, doc.methods.map(facetValue));
    c.excitation.setOne(slot, doc.excitation ?? '');
    c.group.setOne(slot, facetValue(doc.group.slug), doc.group.name);
    c.year.setOne(slot, String(doc.year));
    this.ranges.set(slot, doc.ranges);
    this.sparklines.set(slot, doc.sparkline);
    for (const key of keysOfMaterial) this.formulas.set(key, (this.formulas.get(key) ?? 0) + 1);
    this.pages.dateOrder.insert(slot);
  }

  private unindexColumns(slot: number): void {
    this.changes++;
    this.pages.dateOrder.remove(slot);
    const doc = this.table.docs[slot] as StoredDoc;
    for (const key of materialKeys(doc.material, doc.formula)) {
      const n = (this.formulas.get(key) ?? 1) - 1;
      if (n > 0) this.formulas.set(key, n);
      else this.formulas.delete(key);
    }
    this.facets.clear(slot);
    this.ranges.set(slot, {});
    this.sparklines.clear(slot);
  }

  private growTo(capacity: number): void {
    this.facets.grow(capacity);
    this.ranges.grow(capacity);
    this.sparklines.grow(capacity);
    this.text.grow(capacity);
    this.buffer = new Int32Array(capacity);
    this.keys.dateMs = this.table.dateMs;
  }

  private toSearchDoc(slot: number): SearchDoc {
    return this.table.toSearchDoc(slot, this.ranges.get(slot), this.sparklines.get(slot));
  }
}
