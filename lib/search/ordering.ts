// Result order without sorting the whole result: a kept-sorted newest-first list of slots, and a bounded heap for
// the top k by score. Both break ties the same way (newer first, then version id), so pages never overlap or skip.

export type SlotKeys = { dateMs: Float64Array; versionIdOf: (slot: number) => string };

/** Negative when slot a comes before slot b in "newest first" order. */
export function compareByDate(keys: SlotKeys, a: number, b: number): number {
  const d = keys.dateMs[b] - keys.dateMs[a];
  if (d !== 0) return d;
  const ia = keys.versionIdOf(a), ib = keys.versionIdOf(b);
  return ia < ib ? -1 : ia > ib ? 1 : 0;
}

/** Every live slot, newest first. Rebuilt lazily after bulk loads, kept sorted by insertion afterwards. */
export class DateOrder {
  private order: Int32Array = new Int32Array(0);
  private length = 0;
  private built = false;

  constructor(private readonly keys: SlotKeys) {}

  /** Call after the slot's date is set. */
  insert(slot: number): void {
    if (!this.built) return;
    if (this.length === this.order.length) {
      const next = new Int32Array(Math.max(1024, this.order.length * 2));
      next.set(this.order);
      this.order = next;
    }
    const at = this.position(slot);
    this.order.copyWithin(at + 1, at, this.length);
    this.order[at] = slot;
    this.length++;
  }

  /** Call while the slot's date and version id are still set. */
  remove(slot: number): void {
    if (!this.built) return;
    const at = this.position(slot);
    if (this.order[at] !== slot) {
      this.built = false; // Should not happen; rebuilding is always correct.
      return;
    }
    this.order.copyWithin(at, at + 1, this.length);
    this.length--;
  }

  /** The slots newest first, building the list from `live` if needed. */
  slots(live: () => Int32Array): { order: Int32Array; length: number } {
    if (!this.built) {
      const all = live();
      this.order = all;
      this.length = all.length;
      all.sort((a, b) => compareByDate(this.keys, a, b));
      this.built = true;
    }
    return { order: this.order, length: this.length };
  }

  invalidate(): void {
    this.built = false;
  }

  private position(slot: number): number {
    let lo = 0, hi = this.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (compareByDate(this.keys, this.order[mid], slot) < 0) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }
}

/**
 * The first `k` of `slots[0..length)` by score (high first), ties newest first: a min-heap of size k, so a large
 * result costs O(n log k) instead of a full sort.
 */
export function topByScore(slots: Int32Array, length: number, k: number, score: Float64Array, keys: SlotKeys): number[] {
  if (k <= 0) return [];
  const byRank = (a: number, b: number) => (ranksBefore(a, b, score, keys) ? -1 : ranksBefore(b, a, score, keys) ? 1 : 0);
  if (k >= length) return Array.from(slots.subarray(0, length)).sort(byRank);
  const heap: number[] = []; // heap[0] is the worst of the best k so far
  for (let i = 0; i < length; i++) {
    const s = slots[i];
    if (heap.length < k) {
      heap.push(s);
      for (let c = heap.length - 1; c > 0; ) {
        const p = (c - 1) >> 1;
        if (!ranksBefore(heap[p], heap[c], score, keys)) break;
        [heap[p], heap[c]] = [heap[c], heap[p]];
        c = p;
      }
    } else if (ranksBefore(s, heap[0], score, keys)) {
      heap[0] = s;
      siftDown(heap, score, keys);
    }
  }
  return heap.sort(byRank);
}

/** Whether slot a ranks ahead of slot b: higher score, then newer, then version id. */
function ranksBefore(a: number, b: number, score: Float64Array, keys: SlotKeys): boolean {
  return score[a] > score[b] || (score[a] === score[b] && compareByDate(keys, a, b) < 0);
}

// Restores the heap after its root was replaced: the worst-ranked entry moves back to the root.
function siftDown(heap: number[], score: Float64Array, keys: SlotKeys): void {
  for (let i = 0; ; ) {
    const l = 2 * i + 1, r = l + 1;
    let worst = i;
    if (l < heap.length && ranksBefore(heap[worst], heap[l], score, keys)) worst = l;
    if (r < heap.length && ranksBefore(heap[worst], heap[r], score, keys)) worst = r;
    if (worst === i) return;
    [heap[i], heap[worst]] = [heap[worst], heap[i]];
    i = worst;
  }
}
