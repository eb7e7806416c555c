import { isUnitsRow, splitHeaderLine } from './header';
import type { Delimiter, ParseWarning } from './types';

export type BufferedLine = { no: number; text: string };

const COMMENT_PREFIX = /^\s*(#+|%+|!+|\/\/+|;+)\s?/;
const SECTION = /^\s*\[([^\]]{1,60})\]\s*$/;

export function commentBody(text: string): string | undefined {
  const m = COMMENT_PREFIX.exec(text);
  return m ? text.slice(m[0].length) : undefined;
}

export function sectionName(text: string): string | undefined {
  return SECTION.exec(text)?.[1].trim();
}

function keyValue(text: string, allowComma: boolean): [string, string] | undefined {
  const m = /^\s*([^=:]{1,80}?)\s*[:=]\s*(.*?)\s*$/.exec(text);
  if (m && m[1] !== '' && !/[,;\t]/.test(m[1])) return [m[1], m[2]];
  if (allowComma) {
    const parts = text.split(',').map((p) => p.trim());
    if (parts.length >= 2 && parts[0] !== '') return [parts[0], parts.slice(1).filter(Boolean).join(', ')];
  }
  return undefined;
}

export type Preamble = {
  headerCells: string[] | null;
  headerLine: number | null;
  unitCells: string[] | null;
  metadata: Record<string, string>;
  warnings: ParseWarning[];
};

/** Reads the lines before the data: comment and section metadata, the names row and an optional units row. */
export function readPreamble(lines: BufferedLine[], delimiter: Delimiter, columnCount: number): Preamble {
  const metadata: Record<string, string> = {};
  const put = (key: string, value: string) => {
    let k = key;
    for (let n = 2; k in metadata; n++) k = `${key} (${n})`;
    metadata[k] = value;
  };
  let section: string | undefined;
  const plain: BufferedLine[] = [];
  let lastComment: BufferedLine | undefined;
  for (const line of lines) {
    if (line.text.trim() === '') continue;
    const name = sectionName(line.text);
    if (name !== undefined) {
      section = name;
      continue;
    }
    const body = commentBody(line.text);
    if (body !== undefined) {
      const kv = keyValue(body, false);
      if (kv) put(kv[0], kv[1]);
      else lastComment = { no: line.no, text: body };
      continue;
    }
    if (section !== undefined && section.toLowerCase() !== 'data') {
      const kv = keyValue(line.text, true);
      if (kv) put(section.toLowerCase() === 'header' ? kv[0] : `${section}.${kv[0]}`, kv[1]);
      continue;
    }
    plain.push(line);
  }
  const warnings: ParseWarning[] = [];
  const cellsOf = (l: BufferedLine) => splitHeaderLine(l.text, delimiter, columnCount);
  // A 'key: value' line whose cell count does not match the data is metadata, not the names row.
  const candidates = plain.filter((l) => !keyValue(l.text, false) || cellsOf(l).length === columnCount);
  let header: BufferedLine | undefined = candidates[candidates.length - 1];
  let units: BufferedLine | undefined;
  if (candidates.length >= 2 && isUnitsRow(cellsOf(header))) {
    units = header;
    header = candidates[candidates.length - 2];
  }
  // Lines above the names row that are not metadata-shaped are kept as numbered notes, never silently dropped.
  for (const l of plain) {
    if (l === header || l === units) continue;
    const kv = keyValue(l.text, false);
    if (kv) put(kv[0], kv[1]);
    else put(`line ${l.no}`, l.text.trim());
  }
  if (!header && lastComment && cellsOf(lastComment).length === columnCount && columnCount > 1) header = lastComment;
  if (!header) {
    warnings.push({ line: 0, code: 'no-header', message: `No header row was found; columns are named column_1 … column_${columnCount}. Name them in the column metadata.` });
    return { headerCells: null, headerLine: null, unitCells: null, metadata, warnings };
  }
  return { headerCells: cellsOf(header), headerLine: header.no, unitCells: units ? cellsOf(units) : null, metadata, warnings };
}
