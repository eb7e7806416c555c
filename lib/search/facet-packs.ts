// Filtering and counting several small facets in one pass. Per slot, one code packs the count keys (facet-column.ts,
// countKeys) of facets whose key ranges multiply to at most PACK_SIZE (quantity × method × excitation, group × year).
// A query's filters on those facets become a table from code to failure bits, and one histogram of the codes is split
// back into each facet's counts: the candidates are read once to filter and once to count, whatever the number of
// facets selected (the usual two packs in the same loop). Codes follow every change of a member column
// (FacetColumn.onChange) and are brought up to date, or rebuilt when a dictionary outgrows its field, at the next count.
import type { FacetColumn } from './facet-column';

const PACK_SIZE = 4096;

/** A facet in a pack: its key sits in bits [shift, shift + log2(width)) of the slot's code. */
type Member = { f: number; column: FacetColumn; single: boolean; width: number; shift: number };
type Pack = { members: Member[]; size: number; codes: Int32Array };
type Tally = { histogram: Int32Array; classOf: Int8Array; rowOf: number[] };

export class FacetPacks {
  private packs: Pack[] = [];
  private layout = '';
  private capacity = 0;
  private dirty = new Uint8Array(0);
  private dirtySlots: number[] = [];
  // Reused by countAll(), per pack: a query's histogram and its failure-class table (no fresh typed arrays per query).
  private readonly histograms: Int32Array[] = [];
  private readonly classOf: Int8Array[] = [];

  /** `columns` in FACET_NAMES order (bit f of a failure mask is columns[f]). */
  constructor(private readonly columns: readonly FacetColumn[]) {
    for (const column of columns) column.onChange = (slot) => this.changed(slot);
  }

  grow(capacity: number): void {
    this.capacity = capacity;
    const dirty = new Uint8Array(capacity);
    dirty.set(this.dirty.subarray(0, Math.min(this.dirty.length, capacity)));
    this.dirty = dirty;
    for (const pack of this.packs) {
      const codes = new Int32Array(capacity); // 0: no value in any member, right for slots not yet used
      codes.set(pack.codes.subarray(0, Math.min(pack.codes.length, capacity)));
      pack.codes = codes;
    }
  }

  /** Packs as of now (codes current), each with the facet numbers it covers. */
  current(): readonly Pack[] {
    const plan = this.plan();
    const layout = plan.map((members) => members.map((m) => `${m.f}:${m.width}`).join(',')).join('|');
    if (layout !== this.layout) {
      this.layout = layout;
      this.packs = plan.map((members) => ({ members, size: 1 << members.reduce((bits, m) => bits + Math.log2(m.width), 0), codes: new Int32Array(this.capacity) }));
      for (const pack of this.packs) for (let slot = 0; slot < this.capacity; slot++) pack.codes[slot] = code(pack, slot);
      this.dirty.fill(0);
      this.dirtySlots = [];
    } else if (this.dirtySlots.length) {
      for (const slot of this.dirtySlots) {
        this.dirty[slot] = 0;
        for (const pack of this.packs) pack.codes[slot] = code(pack, slot);
      }
      this.dirtySlots = [];
    }
    return this.packs;
  }

  /**
   * Marks the failures of the selected facets that sit in packs, in one pass over the candidates: per pack, a table
   * from packed code to the failure bits of its selected members (built per query, at most PACK_SIZE entries) is ORed
   * into fail[i]. Slots then failing two facets or more are dropped (they count for no facet and never pass): the rest
   * are kept, in order, at the front of `slots` and `fail`. `flagsOf(f)`: facet f's selection flags per value code, or
   * null when it does not filter. Returns the slots kept and the facets marked here (bit f set).
   */
  markFailures(
    slots: Int32Array,
    length: number,
    fail: Uint8Array,
    flagsOf: (f: number) => Uint8Array | null,
  ): { length: number; marked: number } {
    const packs = this.current();
    let marked = 0;
    const tables = packs.map((pack) => {
      const table = failureTable(pack, flagsOf);
      if (table) for (const m of pack.members) if (flagsOf(m.f)) marked |= 1 << m.f;
      return table ?? NO_FAILURES;
    });
    if (marked === 0) return { length, marked };
    let kept = 0;
    if (packs.length === 2) {
      const [codesA, codesB] = [packs[0].codes, packs[1].codes];
      const [tableA, tableB] = tables;
      for (let i = 0; i < length; i++) {
        const s = slots[i];
        const bits = fail[i] | tableA[codesA[s] & (tableA.length - 1)] | tableB[codesB[s] & (tableB.length - 1)];
        if ((bits & (bits - 1)) !== 0) continue;
        slots[kept] = s;
        fail[kept++] = bits;
      }
      return { length: kept, marked };
    }
    for (let i = 0; i < length; i++) {
      const s = slots[i];
      let bits = fail[i];
      for (let p = 0; p < packs.length; p++) bits |= tables[p][packs[p].codes[s] & (tables[p].length - 1)];
      if ((bits & (bits - 1)) !== 0) continue;
      slots[kept] = s;
      fail[kept++] = bits;
    }
    return { length: kept, marked };
  }

  /**
   * Counts every member of every pack over `slots[0..length)`, writing each facet's counts to counts[f]. `activeMask`:
   * bit f set when facet f filters; then fail[i] holds slot i's failure bits (at most one, see facets.ts), and a facet
   * is counted over the slots that fail no facet or only itself. Two packs (the usual layout) are read in one pass.
   */
  countAll(slots: Int32Array, length: number, fail: Uint8Array, activeMask: number, counts: Int32Array[]): void {
    const packs = this.current();
    const tallies = packs.map((pack, p) => this.tally(pack, p, activeMask));
    if (packs.length === 2) {
      const [a, b] = tallies;
      const codesA = packs[0].codes, codesB = packs[1].codes;
      const histA = a.histogram, histB = b.histogram;
      if (activeMask === 0) {
        for (let i = 0; i < length; i++) {
          const s = slots[i];
          histA[codesA[s]]++;
          histB[codesB[s]]++;
        }
      } else {
        const classA = a.classOf, classB = b.classOf;
        const sizeA = packs[0].size, sizeB = packs[1].size;
        for (let i = 0; i < length; i++) {
          const s = slots[i];
          const f = fail[i];
          const ca = classA[f];
          if (ca >= 0) histA[ca * sizeA + codesA[s]]++;
          const cb = classB[f];
          if (cb >= 0) histB[cb * sizeB + codesB[s]]++;
        }
      }
    } else {
      packs.forEach((pack, p) => {
        const { histogram, classOf } = tallies[p];
        const { codes, size } = pack;
        if (activeMask === 0) {
          for (let i = 0; i < length; i++) histogram[codes[slots[i]]]++;
        } else {
          for (let i = 0; i < length; i++) {
            const c = classOf[fail[i]];
            if (c >= 0) histogram[c * size + codes[slots[i]]]++;
          }
        }
      });
    }
    packs.forEach((pack, p) => split(pack, tallies[p], counts));
  }

  // A pack's histogram, zeroed, with a row per class: 0 = fails nothing; 1 + k = fails only the k-th filtering member
  // (classOf maps a failure mask to its row, −1 when the slot fails a facet outside the pack and counts for none).
  private tally(pack: Pack, p: number, activeMask: number): Tally {
    const classOf = (this.classOf[p] ??= new Int8Array(256)).fill(-1);
    classOf[0] = 0;
    let rows = 1;
    const rowOf = pack.members.map((m) => {
      if (((activeMask >> m.f) & 1) === 0) return 0;
      classOf[1 << m.f] = rows;
      return rows++;
    });
    const cells = rows * pack.size;
    if (!this.histograms[p] || this.histograms[p].length < cells) this.histograms[p] = new Int32Array(cells);
    return { histogram: this.histograms[p].fill(0, 0, cells), classOf, rowOf };
  }

  private changed(slot: number): void {
    if (slot >= this.capacity || this.dirty[slot] === 1) return;
    this.dirty[slot] = 1;
    this.dirtySlots.push(slot);
  }

  // Facets counted by key (countKeys not null) whose field fits, grouped in order while the product of widths fits.
  // A facet alone in its group is left to the plain per-facet count.
  private plan(): Member[][] {
    const groups: Member[][] = [];
    let members: Member[] = [];
    let bits = 0;
    this.columns.forEach((column, f) => {
      const keys = column.countKeys();
      if (!keys) return;
      const single = !column.multiValued;
      const width = single ? nextPowerOfTwo(keys.size + 1) : keys.size; // single: key + 1, 0 for none; multi: 2^n patterns
      const w = Math.log2(width);
      if (width > PACK_SIZE) return;
      if ((1 << (bits + w)) > PACK_SIZE) {
        groups.push(members);
        members = [];
        bits = 0;
      }
      members.push({ f, column, single, width, shift: bits });
      bits += w;
    });
    groups.push(members);
    return groups.filter((g) => g.length >= 2);
  }
}

// A one-entry table: the pack selects nothing (any code masked by length − 1 = 0 reads 0).
const NO_FAILURES = new Uint8Array(1);

// Per packed code, the failure bits of the pack's selected members; null when none of them is selected.
function failureTable(pack: Pack, flagsOf: (f: number) => Uint8Array | null): Uint8Array | null {
  const tests = pack.members.flatMap((m) => {
    const flags = flagsOf(m.f);
    if (!flags) return [];
    // Single-valued: key 0 is "no value", key k is value code k − 1. Multi-valued: the key is the bit pattern.
    let wanted = 0;
    if (!m.single) for (let code = 0; code < flags.length; code++) if (flags[code] === 1) wanted |= 1 << code;
    return [{ m, flags, wanted }];
  });
  if (!tests.length) return null;
  const table = new Uint8Array(pack.size);
  for (let c = 0; c < pack.size; c++) {
    let bits = 0;
    for (const { m, flags, wanted } of tests) {
      const key = (c >> m.shift) & (m.width - 1);
      const passes = m.single ? key > 0 && flags[key - 1] === 1 : (key & wanted) !== 0;
      if (!passes) bits |= 1 << m.f;
    }
    table[c] = bits;
  }
  return table;
}

// Each member's counts from the pack's histogram: rows 0 (fails nothing) and the member's own failure row.
function split(pack: Pack, { histogram, rowOf }: Tally, counts: Int32Array[]): void {
  const { members, size } = pack;
  members.forEach((m, k) => {
    const keys = new Int32Array(m.single ? m.column.values.length : 1 << m.column.values.length);
    for (const row of rowOf[k] > 0 ? [0, rowOf[k]] : [0]) {
      const base = row * size;
      for (let c = 0; c < size; c++) {
        const n = histogram[base + c];
        if (n === 0) continue;
        const key = (c >> m.shift) & (m.width - 1);
        if (!m.single) keys[key] += n;
        else if (key > 0) keys[key - 1] += n;
      }
    }
    counts[m.f] = m.column.countsFrom(keys);
  });
}

function code(pack: Pack, slot: number): number {
  let c = 0;
  for (const m of pack.members) c |= (m.single ? m.column.single[slot] + 1 : m.column.bits[slot]) << m.shift;
  return c;
}

function nextPowerOfTwo(n: number): number {
  let p = 1;
  while (p < n) p *= 2;
  return p;
}
