// Growable column of doubles in fixed-size chunks, so appending never copies what is already stored.
const CHUNK = 1 << 16;

export class ColumnStore {
  private chunks: Float64Array[] = [];
  private current = new Float64Array(CHUNK);
  private pos = 0;
  length = 0;

  push(value: number): void {
    if (this.pos === CHUNK) {
      this.chunks.push(this.current);
      this.current = new Float64Array(CHUNK);
      this.pos = 0;
    }
    this.current[this.pos++] = value;
    this.length++;
  }

  /** One contiguous array of exactly `length` values; the store is emptied to free its chunks. */
  finish(): Float64Array {
    const out = new Float64Array(this.length);
    let offset = 0;
    for (const c of this.chunks) {
      out.set(c, offset);
      offset += CHUNK;
    }
    out.set(this.current.subarray(0, this.pos), offset);
    this.chunks = [];
    this.current = new Float64Array(0);
    this.pos = 0;
    return out;
  }
}
