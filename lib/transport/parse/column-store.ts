// Numeric columns filled row by row, in blocks: a full block is kept as it is and a larger one follows, so appending
// never copies what is stored. With a good size estimate there is one block and `finish` copies nothing either.
export const FIRST_BLOCK_ROWS = 4096;
const MAX_BLOCK_ROWS = 1 << 20;

export class ColumnSet {
  /** The current block of each column: write a row's values at index `pos` (after `reserve()`), then `commit()`. */
  blocks: Float64Array[];
  pos = 0;
  private capacity: number;
  private filled: Float64Array[][];
  private filledRows = 0;

  constructor(columns: number, firstBlockRows = FIRST_BLOCK_ROWS) {
    this.capacity = Math.max(1, Math.floor(firstBlockRows));
    this.blocks = Array.from({ length: columns }, () => new Float64Array(this.capacity));
    this.filled = Array.from({ length: columns }, () => []);
  }

  get length(): number {
    return this.filledRows + this.pos;
  }

  /** Makes room for one more row. */
  reserve(): void {
    if (this.pos < this.capacity) return;
    this.blocks.forEach((block, k) => this.filled[k].push(block));
    this.filledRows += this.capacity;
    this.capacity = Math.min(MAX_BLOCK_ROWS, Math.max(FIRST_BLOCK_ROWS, 2 * this.capacity));
    this.blocks = this.blocks.map(() => new Float64Array(this.capacity));
    this.pos = 0;
  }

  commit(): void {
    this.pos++;
  }

  /** Rows that fit in the current blocks from `pos` on (after `reserve()`, at least one). */
  room(): number {
    return this.capacity - this.pos;
  }

  /** Counts `rows` rows written at pos, pos + 1, … (at most `room()`). */
  advance(rows: number): void {
    this.pos += rows;
  }

  /** Column k as one array of exactly `length` values (a view of the block when it holds them all). */
  finish(k: number): Float64Array {
    const block = this.blocks[k];
    if (this.filled[k].length === 0) {
      // Untouched pages of an over-estimated block cost no memory; copy only when most of it is unused.
      return this.pos === this.capacity ? block : this.pos >= this.capacity / 2 ? block.subarray(0, this.pos) : block.slice(0, this.pos);
    }
    const out = new Float64Array(this.length);
    let offset = 0;
    for (const b of this.filled[k]) {
      out.set(b, offset);
      offset += b.length;
    }
    out.set(block.subarray(0, this.pos), offset);
    this.filled[k] = [];
    return out;
  }
}
