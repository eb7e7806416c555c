import { cellBounds } from './cells';
import { CELL_TEXT, NumberReader } from './number';
import type { DecimalSeparator, Delimiter } from './types';

export type Layout = { delimiter: Delimiter; decimalSeparator: DecimalSeparator; columnCount: number };

// Preference when several delimiters fit equally well: explicit separators before whitespace.
const CANDIDATES: Delimiter[] = ['\t', ';', ',', 'whitespace'];

type Score = { layout: Layout; consistent: number; numericShare: number };

function score(lines: string[], delimiter: Delimiter, decimal: DecimalSeparator, reader: NumberReader): Score {
  const bounds = new Int32Array(2 * 4096);
  const counts = new Map<number, number>();
  let numeric = 0;
  let cells = 0;
  const decimalCode = decimal.charCodeAt(0);
  for (const line of lines) {
    let n = cellBounds(line, 0, line.length, delimiter, bounds);
    if (n > 1 && n <= 4096 && bounds[2 * n - 2] === bounds[2 * n - 1]) n--; // a trailing delimiter adds no column
    counts.set(n, (counts.get(n) ?? 0) + 1);
    for (let k = 0; k < Math.min(n, 4096); k++) {
      reader.read(line, bounds[2 * k], bounds[2 * k + 1], decimalCode);
      cells++;
      if (reader.kind !== CELL_TEXT) numeric++;
    }
  }
  const [columnCount, lineCount] = [...counts.entries()].sort((a, b) => b[1] - a[1] || b[0] - a[0])[0] ?? [0, 0];
  return {
    layout: { delimiter, decimalSeparator: decimal, columnCount },
    consistent: lines.length ? lineCount / lines.length : 0,
    numericShare: cells ? numeric / cells : 0,
  };
}

const PRIORITY = new Map(CANDIDATES.map((d, i) => [d, i]));

// Best first: more numeric cells, then more lines agreeing on the cell count, then the preferred delimiter.
function compare(a: Score, b: Score): number {
  if (Math.abs(a.numericShare - b.numericShare) > 0.02) return b.numericShare - a.numericShare;
  if (Math.abs(a.consistent - b.consistent) > 0.05) return b.consistent - a.consistent;
  return (PRIORITY.get(a.layout.delimiter) ?? 9) - (PRIORITY.get(b.layout.delimiter) ?? 9);
}

/** Delimiter, decimal separator and column count from the first data lines (the mode of the cell count). */
export function detectLayout(sample: string[], forced: { delimiter?: Delimiter; decimalSeparator?: DecimalSeparator } = {}): Layout {
  const reader = new NumberReader();
  const scores: Score[] = [];
  for (const delimiter of forced.delimiter ? [forced.delimiter] : CANDIDATES) {
    // With ',' as the delimiter, a comma cannot also be the decimal mark.
    const decimals: DecimalSeparator[] = forced.decimalSeparator ? [forced.decimalSeparator] : delimiter === ',' ? ['.'] : ['.', ','];
    for (const decimal of decimals) scores.push(score(sample, delimiter, decimal, reader));
  }
  const multi = scores.filter((s) => s.layout.columnCount >= 2 && s.numericShare >= 0.5 && s.consistent >= 0.5).sort(compare);
  if (multi.length > 0) return multi[0].layout;
  // One column of numbers (or nothing better): the whitespace reading.
  const single = scores.filter((s) => s.layout.delimiter === (forced.delimiter ?? 'whitespace')).sort(compare)[0] ?? scores[0];
  return { ...single.layout, columnCount: Math.max(1, single.layout.columnCount) };
}
