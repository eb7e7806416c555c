import { CELL_TEXT, NumberReader } from './number';
import type { Layout } from './delimiter';

// The fast path for data rows of ASCII-compatible files: splits and reads the cells straight from the bytes with
// Clinger's fast path (an integer mantissa below 2^53 times or divided by an exact power of ten ≤ 1e22 is rounded once), so
// every value is the correctly rounded one, bit-identical to the text path's NumberReader and to Number(). Any cell it cannot read
// that way is handed to NumberReader as text; a line with text cells, a wrong cell count, a comment marker or a
// non-ASCII byte is left to the text path, which reports it with its line number.

const POW10 = Float64Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));
const EXACT_LIMIT = 2 ** 53; // every integer below it is a double; a mantissa that reaches it may have been rounded
const SPACE = 32;
const TAB = 9;
const LF = 10;
const CR = 13;

export class ByteRowReader {
  private readonly delimiter: number;
  private readonly decimal: number;
  private readonly cellText = new NumberReader();

  constructor(
    layout: Layout,
    private readonly shifts: Int8Array,
  ) {
    this.delimiter = layout.delimiter === 'whitespace' ? -1 : layout.delimiter.charCodeAt(0);
    this.decimal = layout.decimalSeparator.charCodeAt(0);
  }

  /**
   * Reads the row starting at b[start] into out[k][at], up to the first CR or LF byte, and returns that byte's index; -1 when
   * the line must go through the text path instead. The caller guarantees a CR or LF at or after the line's end, so the
   * scanning loops stop there without bounds checks.
   */
  readRow(b: Uint8Array, start: number, out: Float64Array[], at: number): number {
    const cols = out.length;
    const delimiter = this.delimiter;
    const decimal = this.decimal;
    const whitespace = delimiter < 0;
    let i = start;
    let c = b[i];
    while (c === SPACE || c === TAB) c = b[++i];
    // Only lines that start like a number: blank lines, comments and section markers take the text path.
    if (!((c >= 48 && c <= 57) || c === 45 || c === 43 || c === decimal)) return -1;
    for (let k = 0; k < cols; k++) {
      const cellStart = i;
      while (c === SPACE || c === TAB) c = b[++i];
      // Without a branch: optimised code that has only seen unsigned cells would otherwise deoptimise at the first '-'.
      const negative = c === 45;
      i += +negative | +(c === 43);
      c = b[i];
      // Digits accumulate exactly while the mantissa stays below 2^53 (Clinger's condition, checked once below).
      let mantissa = 0;
      const intStart = i;
      while (c >= 48 && c <= 57) {
        mantissa = mantissa * 10 + (c - 48);
        c = b[++i];
      }
      let digits = i - intStart;
      let exponent = 0;
      if (c === decimal) {
        c = b[++i];
        const fracStart = i;
        while (c >= 48 && c <= 57) {
          mantissa = mantissa * 10 + (c - 48);
          c = b[++i];
        }
        exponent = fracStart - i;
        digits -= exponent;
      }
      let plain = digits > 0;
      if (plain && (c === 101 || c === 69)) {
        c = b[++i];
        let expNegative = false;
        if (c === 45 || c === 43) {
          expNegative = c === 45;
          c = b[++i];
        }
        let e = 0;
        let expDigits = 0;
        while (c >= 48 && c <= 57) {
          if (e < 100000) e = e * 10 + (c - 48);
          expDigits++;
          c = b[++i];
        }
        plain = expDigits > 0;
        exponent += expNegative ? -e : e;
      }
      exponent += this.shifts[k];
      if (!whitespace) while (c === SPACE || c === TAB) c = b[++i];
      const atCellEnd = c === LF || c === CR || (whitespace ? c === SPACE || c === TAB : c === delimiter);
      if (plain && atCellEnd && mantissa < EXACT_LIMIT && exponent <= 22 && exponent >= -22) {
        const magnitude = exponent >= 0 ? mantissa * POW10[exponent] : mantissa / POW10[-exponent];
        out[k][at] = magnitude * (1 - 2 * +negative); // ×(−1) is exact and gives −0 for '-0', as negation does
      } else {
        // Long mantissas, missing markers, quotes, inf: the text reader decides, on the cell's own text.
        while (c !== LF && c !== CR && (whitespace ? c !== SPACE && c !== TAB : c !== delimiter)) c = b[++i];
        const value = this.readAsText(b, cellStart, i, k);
        if (value === undefined) return -1;
        out[k][at] = value;
      }
      // c = b[i] ends the cell: the delimiter, a blank (whitespace layout), CR or LF.
      if (whitespace) while (c === SPACE || c === TAB) c = b[++i];
      if (c === LF || c === CR) return k + 1 === cols ? i : -1;
      if (!whitespace) {
        c = b[++i]; // past the delimiter
        if (c === LF || c === CR) return k + 1 === cols ? i : -1; // one trailing delimiter adds no column (as in the text path)
      }
    }
    return -1; // more cells than columns
  }

  /** The cell through NumberReader; undefined for text cells and non-ASCII bytes (the text path reports those). */
  private readAsText(b: Uint8Array, start: number, end: number, k: number): number | undefined {
    let text = '';
    for (let i = start; i < end; i++) {
      if (b[i] >= 0x80) return undefined;
      text += String.fromCharCode(b[i]);
    }
    const value = this.cellText.read(text, 0, text.length, this.decimal, this.shifts[k]);
    return this.cellText.kind === CELL_TEXT ? undefined : value;
  }
}
