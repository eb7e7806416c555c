// Counting several small facets in one pass. Per slot, one code packs the count keys (facet-column.ts, countKeys) of
// facets whose key ranges multiply to at most PACK_SIZE (quantity × method × excitation, group × year); one histogram
// of those codes per query is then split back into each facet's counts. A query's candidates are read once per pack
// instead of once per facet. Codes follow every change of a member column (FacetColumn.onChange) and are brought up to
// date, or rebuilt when a dictionary outgrows its field, at the next count.
import type { FacetColumn } from './facet-column';

const PACK_SIZE = 4096;

/** A facet in a pack: its key sits in bits [shift, shift + log2(width)) of the slot's code. */
type Member = { f: number; column: FacetColumn; single: boolean; width: number; shift: number };
type Pack = { members: Member[]; size: number; codes: Int32Array };

export class FacetPacks {
  private packs: Pack[] = [];
  private layout = '';
  private capacity = 0;
  private dirty = new Uint8Array(0);
  private dirtySlots: number[] = [];
  // Reused by count(): a query's histogram and its failure-class table (no fresh typed arrays per query).
  private histogram = new Int32Array(0);
  private readonly classOf = new Int8Array(256);

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
   * Counts every member of `pack` over `slots[0..length)`, writing each facet's counts to counts[f]. `activeMask`: bit
   * f set when facet f filters; then fail[i] holds slot i's failure bits (at most one, see facets.ts), and a facet is
   * counted over the slots that fail no facet or only itself.
   */
  count(pack: Pack, slots: Int32Array, length: number, fail: Uint8Array, activeMask: number, counts: Int32Array[]): void {
    const { members, size, codes } = pack;
    // Histogram row per class: 0 = fails nothing; 1 + k = fails only the k-th filtering member.
    const classOf = this.classOf.fill(-1);
    classOf[0] = 0;
    let rows = 1;
    const rowOf = members.map((m) => {
      if (((activeMask >> m.f) & 1) === 0) return 0;
      classOf[1 << m.f] = rows;
      return rows++;
    });
    if (this.histogram.length < rows * size) this.histogram = new Int32Array(rows * size);
    const histogram = this.histogram.fill(0, 0, rows * size);
    if (activeMask === 0) {
      for (let i = 0; i < length; i++) histogram[codes[slots[i]]]++;
    } else {
      for (let i = 0; i < length; i++) {
        const c = classOf[fail[i]];
        if (c >= 0) histogram[c * size + codes[slots[i]]]++;
      }
    }
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
