import { CELL_NUMBER, CELL_TEXT, NumberReader } from './number';
import type { Delimiter } from './types';

/** Cell boundaries of s[start, end) as [cellStart, cellEnd) pairs in `out`; returns the cell count. */
export function cellBounds(s: string, start: number, end: number, delimiter: Delimiter, out: Int32Array): number {
  let n = 0;
  const max = out.length >> 1;
  if (delimiter === 'whitespace') {
    let i = start;
    while (i < end) {
      while (i < end && isBlank(s.charCodeAt(i))) i++;
      if (i >= end) break;
      const cellStart = i;
      while (i < end && !isBlank(s.charCodeAt(i))) i++;
      if (n < max) {
        out[2 * n] = cellStart;
        out[2 * n + 1] = i;
      }
      n++;
    }
    return n;
  }
  const code = delimiter.charCodeAt(0);
  let cellStart = start;
  for (let i = start; i < end; i++) {
    if (s.charCodeAt(i) === code) {
      if (n < max) {
        out[2 * n] = cellStart;
        out[2 * n + 1] = i;
      }
      n++;
      cellStart = i + 1;
    }
  }
  if (n < max) {
    out[2 * n] = cellStart;
    out[2 * n + 1] = end;
  }
  return n + 1;
}

const isBlank = (c: number) => c === 32 || c === 9;

/** Share of cells of a line that read as numbers or missing markers, splitting on any likely delimiter. */
export function numericShare(line: string, reader: NumberReader): { numbers: number; cells: number } {
  const tokens = line.split(/[,;\t ]+/).filter((t) => t !== '');
  let numbers = 0;
  let text = 0;
  for (const t of tokens) {
    reader.read(t, 0, t.length, 46);
    if (reader.kind === CELL_TEXT) text++;
    else if (reader.kind === CELL_NUMBER) numbers++;
  }
  return { numbers, cells: numbers + text };
}

export function looksLikeData(line: string, reader: NumberReader): boolean {
  const { numbers, cells } = numericShare(line, reader);
  return numbers > 0 && numbers >= 0.5 * cells;
}
