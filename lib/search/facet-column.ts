// One facet's values for every indexed version: a dictionary of values, and per slot the value codes (a code per slot
// for single-valued facets; shared code lists plus, up to 32 values, a bit set for multi-valued ones). The loops here
// run over every candidate of a query, so they stay on typed arrays.

const BITS = 32;
// Up to this many values, a multi-valued facet is counted by bit pattern (≤ 4096 patterns) like a single-valued one.
const PATTERN_BITS = 12;
const HISTOGRAM_MAX = 65_536;

/** One facet: a dictionary of values and, per slot, the codes of the values the version has. */
export class FacetColumn {
  private readonly codeOf = new Map<string, number>();
  readonly values: string[] = [];
  readonly labels: (string | undefined)[] = [];
  /** Single-valued: the code per slot, -1 for none. */
  single: Int32Array;
  /** Multi-valued: the code list per slot (lists shared between equal sets), and while ≤ 32 values, a bit set. */
  readonly lists: number[][] = [];
  bits: Int32Array;
  /** Called with the slot after every change of its values (facet-packs.ts keeps packed codes from it). */
  onChange: ((slot: number) => void) | null = null;
  private readonly sharedLists = new Map<string, number[]>();

  constructor(readonly multiValued: boolean, capacity: number) {
    this.single = new Int32Array(capacity).fill(-1);
    this.bits = new Int32Array(multiValued ? capacity : 0);
  }

  /** Whether the bit sets are in use (multi-valued, and at most 32 distinct values seen). */
  get usesBits(): boolean {
    return this.multiValued && this.values.length <= BITS;
  }

  grow(capacity: number): void {
    const next = new Int32Array(capacity).fill(-1);
    next.set(this.single.subarray(0, Math.min(this.single.length, capacity)));
    this.single = next;
    if (this.multiValued) {
      const bits = new Int32Array(capacity);
      bits.set(this.bits.subarray(0, Math.min(this.bits.length, capacity)));
      this.bits = bits;
    }
  }

  /**
   * Per slot, the index this facet is counted under (facets.ts): the value code (single-valued) or the bit pattern
   * (multi-valued, ≤ 12 values); null when it has to be counted value by value (count()).
   */
  countKeys(): { keys: Int32Array; size: number } | null {
    if (!this.multiValued) return { keys: this.single, size: this.values.length };
    return this.values.length <= PATTERN_BITS ? { keys: this.bits, size: 1 << this.values.length } : null;
  }

  /** Value counts from a histogram over countKeys(). */
  countsFrom(histogram: Int32Array): Int32Array {
    if (!this.multiValued) return histogram;
    const counts = new Int32Array(this.values.length);
    for (let pattern = 1; pattern < histogram.length; pattern++) {
      const n = histogram[pattern];
      if (n) for (let m = pattern; m !== 0; m &= m - 1) counts[31 - Math.clz32(m & -m)] += n;
    }
    return counts;
  }

  lookup(value: string): number | undefined {
    return this.codeOf.get(value);
  }

  /** A single-valued facet's value (with its display label); '' means none. */
  setOne(slot: number, value: string, label?: string): void {
    this.single[slot] = value === '' ? -1 : this.code(value, label);
    this.onChange?.(slot);
  }

  /** A multi-valued facet's values; empty strings are ignored. */
  setMany(slot: number, values: readonly string[]): void {
    const codes: number[] = [];
    for (const value of values) {
      if (value === '') continue;
      const code = this.code(value);
      if (!codes.includes(code)) codes.push(code);
    }
    codes.sort((a, b) => a - b);
    const key = codes.join(',');
    let list = this.sharedLists.get(key);
    if (!list) this.sharedLists.set(key, (list = codes));
    this.lists[slot] = list;
    let bits = 0;
    for (const code of codes) if (code < BITS) bits |= 1 << code;
    this.bits[slot] = bits;
    this.onChange?.(slot);
  }

  clear(slot: number): void {
    if (this.multiValued) {
      this.lists[slot] = EMPTY;
      this.bits[slot] = 0;
    } else this.single[slot] = -1;
    this.onChange?.(slot);
  }

  /** Selection flags per code for the given values; unknown values select nothing (and so match nothing). */
  selection(values: readonly string[]): Uint8Array {
    const flags = new Uint8Array(this.values.length);
    for (const v of values) {
      const code = this.codeOf.get(v);
      if (code !== undefined) flags[code] = 1;
    }
    return flags;
  }

  /** Writes to `into` every slot below `upTo` that has one of the selected values; returns how many. */
  slotsWith(flags: Uint8Array, upTo: number, into: Int32Array): number {
    let n = 0;
    if (!this.multiValued) {
      const single = this.single;
      for (let s = 0; s < upTo; s++) if (flags[single[s]] === 1) into[n++] = s;
    } else if (this.usesBits) {
      let wanted = 0;
      for (let code = 0; code < flags.length; code++) if (flags[code] === 1) wanted |= 1 << code;
      const bits = this.bits;
      for (let s = 0; s < upTo; s++) if ((bits[s] & wanted) !== 0) into[n++] = s;
    } else {
      const lists = this.lists;
      for (let s = 0; s < upTo; s++) {
        const list = lists[s];
        if (list && list.some((code) => flags[code] === 1)) into[n++] = s;
      }
    }
    return n;
  }

  /** Sets bit `bit` of fail[i] for every slots[i] that has none of the selected values. */
  markFailures(slots: Int32Array, length: number, flags: Uint8Array, fail: Uint8Array, bit: number): void {
    if (!this.multiValued) {
      const single = this.single;
      for (let i = 0; i < length; i++) if (flags[single[slots[i]]] !== 1) fail[i] |= bit;
      return;
    }
    if (this.usesBits) {
      let wanted = 0;
      for (let code = 0; code < flags.length; code++) if (flags[code] === 1) wanted |= 1 << code;
      const bits = this.bits;
      for (let i = 0; i < length; i++) if ((bits[slots[i]] & wanted) === 0) fail[i] |= bit;
      return;
    }
    const lists = this.lists;
    for (let i = 0; i < length; i++) {
      const list = lists[slots[i]];
      let hit = false;
      for (let j = 0; j < list.length && !hit; j++) hit = flags[list[j]] === 1;
      if (!hit) fail[i] |= bit;
    }
  }

  /** Counts values over slots[i] whose fail[i] has no bit outside `ignore`. */
  count(slots: Int32Array, length: number, fail: Uint8Array, ignore: number): Int32Array {
    const counts = new Int32Array(this.values.length);
    const others = ~ignore & 0xff;
    if (!this.multiValued) {
      const single = this.single;
      for (let i = 0; i < length; i++) {
        if ((fail[i] & others) !== 0) continue;
        const code = single[slots[i]];
        if (code >= 0) counts[code]++;
      }
    } else if (this.usesBits) {
      const bits = this.bits;
      for (let i = 0; i < length; i++) {
        if ((fail[i] & others) !== 0) continue;
        for (let m = bits[slots[i]]; m !== 0; m &= m - 1) counts[31 - Math.clz32(m & -m)]++;
      }
    } else {
      const lists = this.lists;
      for (let i = 0; i < length; i++) {
        if ((fail[i] & others) !== 0) continue;
        const list = lists[slots[i]];
        for (let j = 0; j < list.length; j++) counts[list[j]]++;
      }
    }
    return counts;
  }

  /**
   * Codes of the `limit` largest counts (ties by value, alphabetically), largest first. A histogram of the counts
   * finds the cut-off in two passes; only the codes at or above it are sorted with the tie-break.
   */
  topCodes(counts: Int32Array, limit: number): number[] {
    let max = 0, nonZero = 0;
    for (let code = 0; code < counts.length; code++) {
      if (counts[code] > max) max = counts[code];
      if (counts[code] > 0) nonZero++;
    }
    let cutOff = 1;
    if (nonZero > limit && max > HISTOGRAM_MAX) {
      // Very large counts: a numeric sort of the counts instead of a histogram that big.
      cutOff = Int32Array.from(counts).sort()[counts.length - limit];
    } else if (nonZero > limit) {
      const histogram = new Int32Array(max + 1);
      for (let code = 0; code < counts.length; code++) histogram[counts[code]]++;
      for (let c = max, seen = 0; c >= 1; c--) {
        seen += histogram[c];
        if (seen >= limit) {
          cutOff = c;
          break;
        }
      }
    }
    const picked: number[] = [];
    for (let code = 0; code < counts.length; code++) if (counts[code] >= cutOff) picked.push(code);
    const rank = this.alphabeticalRank();
    picked.sort((a, b) => counts[b] - counts[a] || rank[a] - rank[b]);
    return picked.slice(0, limit);
  }

  private rank = new Int32Array(0);

  // Alphabetical position of every value, recomputed only when the dictionary has grown.
  private alphabeticalRank(): Int32Array {
    if (this.rank.length !== this.values.length) {
      const byRank = this.values.map((_, code) => code).sort((a, b) => (this.values[a] < this.values[b] ? -1 : 1));
      this.rank = new Int32Array(this.values.length);
      byRank.forEach((code, r) => (this.rank[code] = r));
    }
    return this.rank;
  }

  private code(value: string, label?: string): number {
    let code = this.codeOf.get(value);
    if (code === undefined) {
      code = this.values.length;
      this.codeOf.set(value, code);
      this.values.push(value);
      this.labels.push(label !== undefined && label !== value ? label : undefined);
    }
    return code;
  }
}

const EMPTY: number[] = [];
