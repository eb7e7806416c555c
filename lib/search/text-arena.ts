// The longer text of every indexed version (title, description, DOI, dataset id) as UTF-8 in one growable byte buffer,
// outside the JavaScript heap: 100 k versions' text costs its bytes and no per-string headers (and no 2 bytes per
// character for text with a dash or a subscript), and the garbage collector never walks it. Strings are decoded again
// only for the page of hits being returned. Values are well-formed text (they come from utf8mb4 columns), so the
// round trip through UTF-8 gives back the same string.

const encoder = new TextEncoder();
const NULL = -1;
const decoder = new TextDecoder();

export class TextArena {
  private bytes = new Uint8Array(1 << 20);
  private used = 0;
  private garbage = 0; // bytes of replaced or cleared values, reclaimed by compact()
  private start = new Int32Array(0);
  private length = new Int32Array(0); // bytes per value; NULL for a null value

  /** `fields`: how many strings each slot keeps. */
  constructor(private readonly fields: number) {}

  grow(capacity: number): void {
    const start = new Int32Array(capacity * this.fields);
    const length = new Int32Array(capacity * this.fields);
    start.set(this.start.subarray(0, Math.min(this.start.length, start.length)));
    length.set(this.length.subarray(0, Math.min(this.length.length, length.length)));
    this.start = start;
    this.length = length;
  }

  /** Stores the slot's values, one per field; null is kept apart from '' (see getOrNull). */
  set(slot: number, values: readonly (string | null)[]): void {
    for (let f = 0; f < this.fields; f++) {
      const at = slot * this.fields + f;
      this.garbage += Math.max(0, this.length[at]);
      const value = values[f] ?? null;
      if (value === null) {
        this.start[at] = 0;
        this.length[at] = NULL;
        continue;
      }
      this.reserve(value.length * 3); // UTF-8 needs at most 3 bytes per UTF-16 unit
      const { written } = encoder.encodeInto(value, this.bytes.subarray(this.used));
      this.start[at] = this.used;
      this.length[at] = written;
      this.used += written;
    }
    if (this.garbage > this.used / 2 && this.garbage > 1 << 20) this.compact();
  }

  /** The value ('' for null, for a cleared slot and for one never set). */
  get(slot: number, field: number): string {
    const at = slot * this.fields + field;
    const n = this.length[at];
    return n <= 0 ? '' : decoder.decode(this.bytes.subarray(this.start[at], this.start[at] + n));
  }

  /** The value, or null where null was stored. */
  getOrNull(slot: number, field: number): string | null {
    return this.length[slot * this.fields + field] === NULL ? null : this.get(slot, field);
  }

  clear(slot: number): void {
    for (let f = 0; f < this.fields; f++) {
      const at = slot * this.fields + f;
      this.garbage += Math.max(0, this.length[at]);
      this.length[at] = 0;
    }
  }

  private reserve(extra: number): void {
    if (this.used + extra <= this.bytes.length) return;
    const next = new Uint8Array(Math.max(this.used + extra, Math.ceil(this.bytes.length * 1.25))); // +25 %: little idle space
    next.set(this.bytes.subarray(0, this.used));
    this.bytes = next;
  }

  // Copies the live values into a fresh buffer once at least half of the bytes are garbage.
  private compact(): void {
    const next = new Uint8Array(Math.max(1 << 20, Math.ceil((this.used - this.garbage) * 1.25)));
    let used = 0;
    for (let at = 0; at < this.start.length; at++) {
      const n = this.length[at];
      if (n <= 0) continue;
      next.set(this.bytes.subarray(this.start[at], this.start[at] + n), used);
      this.start[at] = used;
      used += n;
    }
    this.bytes = next;
    this.used = used;
    this.garbage = 0;
  }
}
