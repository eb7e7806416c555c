import { ucumFromText, unitInfo } from '@/lib/transport/units';
import { quantityFromName } from './quantity-names';
import type { Delimiter } from './types';

/** Splits one line on a delimiter, honouring "double-quoted" cells (RFC 4180 quoting, "" for a quote). */
export function splitQuoted(line: string, delimiter: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === delimiter) {
      cells.push(cell.trim());
      cell = '';
    } else cell += ch;
  }
  cells.push(cell.trim());
  return cells;
}

const BRACKETED = /^[([{].*[)\]}]$/;

// Whitespace headers: "T (K)  R (Ohm)" must give 2 names, so units in brackets stay with their name.
function mergeBracketUnits(tokens: string[]): string[] {
  const out: string[] = [];
  for (const t of tokens) {
    if (out.length > 0 && BRACKETED.test(t)) out[out.length - 1] += ` ${t}`;
    else out.push(t);
  }
  return out;
}

/** Header cells of one line; for whitespace files, the split that yields `expected` cells wins. */
export function splitHeaderLine(line: string, delimiter: Delimiter, expected: number): string[] {
  if (delimiter !== 'whitespace') {
    const cells = splitQuoted(line, delimiter);
    // A trailing delimiter ("T,R,") adds an empty last cell that is not a column.
    if (cells.length === expected + 1 && cells[cells.length - 1] === '') cells.pop();
    return cells;
  }
  const trimmed = line.trim();
  const candidates = [
    trimmed.split('\t').map((s) => s.trim()),
    trimmed.split(/\s{2,}|\t/).map((s) => s.trim()),
    mergeBracketUnits(trimmed.split(/\s+/)),
    trimmed.split(/\s+/),
  ];
  return candidates.find((c) => c.length === expected) ?? candidates[2];
}

export type HeaderCell = { name: string; unitText: string | null };

// A unit after '/', '_' or a space is accepted only when it fits what the name says ('V_g' is not volts in grams).
function fitsName(name: string, unitText: string): boolean {
  const byName = quantityFromName(name);
  const read = ucumFromText(unitText);
  if (!byName || !read) return false;
  const dim = unitInfo(read.ucum)?.dimension;
  const fits: Record<string, string[]> = {
    temperature: ['temperature'], field: ['magneticFluxDensity', 'magneticFieldStrength'], current: ['current'],
    resistance: ['resistance'], 'hall-resistance': ['resistance'], 'sheet-resistance': ['sheetResistance', 'resistance'],
    resistivity: ['resistivity'], 'hall-resistivity': ['resistivity'], voltage: ['voltage'], 'gate-voltage': ['voltage'],
    frequency: ['frequency'], time: ['time'], angle: ['angle'], 'lock-in-x': ['voltage'], 'lock-in-y': ['voltage'],
    'thermometer-resistance': ['resistance'], magnetoresistance: ['dimensionless'],
  };
  return dim !== undefined && (fits[byName.quantity] ?? []).includes(dim);
}

/** Name and unit text of one header cell: 'T (K)', 'R [mOhm]', 'B/T', 'Rxx_Ohm', 'rho (µΩ cm)', 'Temperature K'. */
export function splitHeaderCell(raw: string): HeaderCell {
  const text = raw.trim().replace(/^"(.*)"$/, '$1').trim();
  const bracket = /^(.*?)\s*[([{]([^()[\]{}]*)[)\]}]\s*$/.exec(text);
  if (bracket && bracket[1] !== '') return { name: bracket[1].trim(), unitText: bracket[2].trim() || null };
  const slash = /^([^/]+?)\s*\/\s*([^/]+)$/.exec(text);
  if (slash && fitsName(slash[1], slash[2])) return { name: slash[1].trim(), unitText: slash[2].trim() };
  const underscore = /^(.+)_([^_]+)$/.exec(text);
  if (underscore && fitsName(underscore[1], underscore[2])) return { name: underscore[1], unitText: underscore[2] };
  const spaced = /^(.+?)\s+(\S+)$/.exec(text);
  if (spaced && fitsName(spaced[1], spaced[2])) return { name: spaced[1], unitText: spaced[2] };
  return { name: text, unitText: null };
}

/** True when every non-empty cell reads as a unit: the line is a units row under the names row. */
export function isUnitsRow(cells: string[]): boolean {
  const filled = cells.map((c) => c.trim().replace(/^[([{](.*)[)\]}]$/, '$1')).filter((c) => c !== '');
  return filled.length > 0 && filled.every((c) => ucumFromText(c) !== undefined || /^[µumkM]?W$/.test(c));
}
