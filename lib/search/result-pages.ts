// Picks one page of results in the requested order without sorting whole results: newest first by walking the kept
// date order, by relevance with a bounded heap (ordering.ts).
import { compareByDate, DateOrder, topByScore, type SlotKeys } from './ordering';
import type { SlotTable } from './slot-table';

/** Results up to this size are sorted by date directly; larger ones are read off the kept date order. */
const SORT_AT_MOST = 256;

export class ResultPages {
  readonly dateOrder: DateOrder;

  constructor(private readonly table: SlotTable, private readonly keys: SlotKeys) {
    this.dateOrder = new DateOrder(keys);
  }

  /** A page of every (latest) version, newest first. */
  newestOfAll(latestOnly: boolean, offset: number, pageSize: number): number[] {
    const latest = this.table.latest;
    return this.walk(offset, pageSize, latestOnly ? (s) => latest[s] === 1 : () => true);
  }

  /** A page of `slots[0..length)`, newest first. */
  newestOf(slots: Int32Array, length: number, offset: number, pageSize: number): number[] {
    if (length <= SORT_AT_MOST) {
      const all = Array.from(slots.subarray(0, length)).sort((a, b) => compareByDate(this.keys, a, b));
      return all.slice(offset, offset + pageSize);
    }
    return this.walk(offset, pageSize, this.table.mark(slots, length));
  }

  /** A page of `slots[0..length)` by score, high first (ties newest first). */
  byScore(slots: Int32Array, length: number, offset: number, pageSize: number, score: Float64Array): number[] {
    return topByScore(slots, length, offset + pageSize, score, this.keys).slice(offset);
  }

  // The walk stops as soon as the page is full.
  private walk(offset: number, pageSize: number, wanted: (slot: number) => boolean): number[] {
    const { order, length } = this.dateOrder.slots(() => this.table.liveSlots(new Int32Array(this.table.size), false).slots);
    const out: number[] = [];
    let skipped = 0;
    for (let i = 0; i < length && out.length < pageSize; i++) {
      if (!wanted(order[i])) continue;
      if (skipped++ >= offset) out.push(order[i]);
    }
    return out;
  }
}
