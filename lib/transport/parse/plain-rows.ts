// The fast path for data rows of ASCII-compatible files: reads whole rows of plain numbers straight from the bytes into
// the columns, many rows a call. Clinger's fast path (PLDI 1990: an integer mantissa below 2^53 times or divided by an
// exact power of ten ≤ 1e22 is rounded once) gives the correctly rounded value; longer mantissas and larger exponents
// go through Number() on the cell's text exactly as NumberReader does. So every value is bit-identical to the text
// path's. The first line that is not a row of plain numbers (comment, blank, text, quotes, missing markers, a wrong
// cell count, a non-ASCII byte, a stray CR) stops the call; the caller hands that line to the text path.
//
// readPlainRows is self-contained (no imports, no closures, no nested functions): the parallel reader sends its source
// text to worker threads, so main thread and workers run the very same code.

/** How a row is laid out, as bytes. */
export type RowFormat = {
  /** The delimiter's byte, or -1 when cells are separated by runs of blanks. */
  delimiter: number;
  /** The decimal separator's byte. */
  decimal: number;
  /** Per column, the power of ten folded into the exponent (a decimal unit prefix, see decimalShift). */
  shifts: Int8Array;
  /** 10^0 … 10^22, all exact doubles (POW10). */
  pow10: Float64Array;
};

export const POW10 = Float64Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

export function rowFormat(delimiter: string, decimalSeparator: string, shifts: Int8Array): RowFormat {
  return { delimiter: delimiter === 'whitespace' ? -1 : delimiter.charCodeAt(0), decimal: decimalSeparator.charCodeAt(0), shifts, pow10: POW10 };
}

/**
 * A cell that is not a plain number (quotes, missing markers, inf, blanks): its value, or undefined to leave the whole
 * line to the text path. `start`/`end` bound the cell with its blanks; `k` is the column.
 */
export type CellFallback = (b: Uint8Array, start: number, end: number, k: number) => number | undefined;

/** Where the next untaken line starts, after readPlainRows. */
export type RowCursor = { next: number };

/** Numbers a column has in a statistics array (emptyStats). */
export const STATS_PER_COLUMN = 4;

/**
 * Running statistics of columns, four numbers a column: the smallest and largest finite value (±Infinity while there is
 * none; the first of equal values, so 0 before −0 stays 0), the count of NaN values and the count of ±Infinity values.
 */
export function emptyStats(columns: number, stats: Float64Array = new Float64Array(STATS_PER_COLUMN * columns)): Float64Array {
  for (let r = 0; r < STATS_PER_COLUMN * columns; r += STATS_PER_COLUMN) {
    stats[r] = Infinity;
    stats[r + 1] = -Infinity;
    stats[r + 2] = 0;
    stats[r + 3] = 0;
  }
  return stats;
}

/** Folds the statistics of later rows (`more`) into `stats`, as if those rows had been counted one by one after. */
export function mergeStats(stats: Float64Array, more: Float64Array): void {
  for (let r = 0; r < stats.length; r += STATS_PER_COLUMN) {
    if (more[r] < stats[r]) stats[r] = more[r];
    if (more[r + 1] > stats[r + 1]) stats[r + 1] = more[r + 1];
    stats[r + 2] += more[r + 2];
    stats[r + 3] += more[r + 3];
  }
}

/**
 * Reads rows from the line starting at b[start] into out[k][at], out[k][at + 1], …: at most `maxRows` rows, and only
 * lines that start at or before `last`, where b[last] is a line break `sep` (LF, with CR LF taken as one, or CR).
 * Returns the number of rows read; cursor.next is then the index of the first line not taken. out[k] must have room for
 * `maxRows` more values from `at`. A line that stops the call may have written values at out[k][at + rows]: they are
 * not counted (in rows or in `stats`, see emptyStats), and the next row overwrites them.
 */
export function readPlainRows(
  b: Uint8Array,
  start: number,
  last: number,
  sep: number,
  out: Float64Array[],
  at: number,
  maxRows: number,
  format: RowFormat,
  fallback: CellFallback | null,
  cursor: RowCursor,
  stats: Float64Array,
): number {
  const cols = out.length;
  const delimiter = format.delimiter;
  const decimal = format.decimal;
  const shifts = format.shifts;
  const pow10 = format.pow10;
  const whitespace = delimiter < 0;
  let p = start;
  let rows = 0;
  lines: while (p <= last && rows < maxRows) {
    let i = p;
    let c = b[i];
    while (c === 32 || c === 9) c = b[++i];
    // Only lines that start like a number: blank lines, comments and section markers take the text path.
    if (!((c >= 48 && c <= 57) || c === 45 || c === 43 || c === decimal)) break;
    for (let k = 0; ; ) {
      const cellStart = i;
      while (c === 32 || c === 9) c = b[++i];
      const numberStart = i;
      // Without a branch: optimised code that has only seen unsigned cells would otherwise deoptimise at the first '-'.
      const negative = c === 45;
      i += +negative | +(c === 43);
      c = b[i];
      // The mantissa is exact while it stays below 2^53 (Clinger's condition, checked once below).
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
      let hasExponent = false;
      if (plain && (c === 101 || c === 69)) {
        hasExponent = true;
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
      const shift = shifts[k];
      exponent += shift;
      const numberEnd = i;
      if (!whitespace) while (c === 32 || c === 9) c = b[++i];
      const atCellEnd = c === 10 || c === 13 || (whitespace ? c === 32 || c === 9 : c === delimiter);
      if (plain && atCellEnd && mantissa < 9007199254740992 && exponent <= 22 && exponent >= -22) {
        // 10^|exponent| ≤ 1e22 is exact in a double, so this rounds once; ×(−1) is exact and gives −0 for '-0'.
        out[k][at + rows] = (exponent >= 0 ? mantissa * pow10[exponent] : mantissa / pow10[-exponent]) * (1 - 2 * +negative);
      } else if (plain && atCellEnd) {
        // A long mantissa or a large exponent: Number() on the cell's text, as NumberReader does.
        let text = '';
        for (let j = numberStart; j < numberEnd; j++) text += String.fromCharCode(b[j] === decimal ? 46 : b[j]);
        out[k][at + rows] = shift === 0 ? Number(text) : hasExponent ? Number(text) * Number(`1e${shift}`) : Number(`${text}e${shift}`);
      } else {
        // Quotes, missing markers, inf, text: the fallback decides on the cell's own bytes (none: the text path).
        while (c !== 10 && c !== 13 && (whitespace ? c !== 32 && c !== 9 : c !== delimiter)) c = b[++i];
        const value = fallback === null ? undefined : fallback(b, cellStart, i, k);
        if (value === undefined) break lines;
        out[k][at + rows] = value;
      }
      // c = b[i] ends the cell: the delimiter, a blank (whitespace layout), CR or LF.
      if (whitespace) while (c === 32 || c === 9) c = b[++i];
      if (c === 10 || c === 13) {
        if (k + 1 !== cols) break lines; // fewer cells than columns
        break;
      }
      if (!whitespace) {
        c = b[++i]; // past the delimiter
        if (c === 10 || c === 13) {
          if (k + 1 !== cols) break lines;
          break; // one trailing delimiter adds no column (as in the text path)
        }
      }
      if (++k === cols) break lines; // more cells than columns
    }
    // c = b[i] is the CR or LF that ended the row: it must be the line break itself.
    let lineBreak = -1;
    if (c === sep) lineBreak = i;
    else if (sep === 10 && c === 13 && b[i + 1] === 10) lineBreak = i + 1;
    if (lineBreak < 0) break;
    // The row is in: count its values (file order, so the first of equal values is kept).
    const row = at + rows;
    for (let k = 0, r = 0; k < cols; k++, r += 4) {
      const v = out[k][row];
      if (v - v === 0) {
        if (v < stats[r]) stats[r] = v;
        if (v > stats[r + 1]) stats[r + 1] = v;
      } else if (v !== v) stats[r + 2]++;
      else stats[r + 3]++;
    }
    rows++;
    p = lineBreak + 1;
  }
  cursor.next = p;
  return rows;
}
