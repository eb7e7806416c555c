// Number cells without regex or substrings: Clinger's fast path (PLDI 1990, "How to read floating point numbers
// accurately"): an integer mantissa below 2^53 times or divided by an exact power of ten up to 1e22 is rounded
// once, so it equals parseFloat. Anything longer falls back to Number() on the cell text.
import { POW10 } from './plain-rows';

export const CELL_NUMBER = 0;
export const CELL_BLANK = 1;
export const CELL_MISSING = 2;
export const CELL_TEXT = 3;
export type CellKind = typeof CELL_NUMBER | typeof CELL_BLANK | typeof CELL_MISSING | typeof CELL_TEXT;

const EXACT_LIMIT = 2 ** 53; // integers below it are exact doubles
const MISSING_WORDS = new Set(['nan', '-nan', '+nan', 'na', 'n/a', '--', '-', '---', 'null', 'none', '?', '*']);

const isSpace = (c: number) => c === 32 || c === 9;

/** Reusable result holder so the hot loop allocates nothing. */
export class NumberReader {
  kind: CellKind = CELL_NUMBER;

  /**
   * Value of s[start, end) (trimmed, quotes removed) times 10^shift; NaN with kind BLANK, MISSING or TEXT when it is not
   * a number. The shift folds a decimal unit prefix into the exponent, so '15.3' mΩ becomes exactly 0.0153 Ω.
   */
  read(s: string, start: number, end: number, decimalCode: number, shift = 0): number {
    while (start < end && isSpace(s.charCodeAt(start))) start++;
    while (end > start && isSpace(s.charCodeAt(end - 1))) end--;
    if (end - start >= 2 && s.charCodeAt(start) === 34 && s.charCodeAt(end - 1) === 34) {
      start++;
      end--;
    }
    if (start === end) {
      this.kind = CELL_BLANK;
      return NaN;
    }
    let i = start;
    let c = s.charCodeAt(i);
    let negative = false;
    if (c === 45 || c === 43) {
      negative = c === 45;
      c = s.charCodeAt(++i);
    }
    let mantissa = 0;
    let significant = 0;
    let digits = 0;
    let exponent = 0;
    while (i < end && c >= 48 && c <= 57) {
      if (significant > 0 || c !== 48) {
        mantissa = mantissa * 10 + (c - 48);
        significant++;
      }
      digits++;
      c = s.charCodeAt(++i);
    }
    if (i < end && c === decimalCode) {
      c = s.charCodeAt(++i);
      while (i < end && c >= 48 && c <= 57) {
        if (significant > 0 || c !== 48) {
          mantissa = mantissa * 10 + (c - 48);
          significant++;
        }
        exponent--;
        digits++;
        c = s.charCodeAt(++i);
      }
    }
    if (digits === 0) return this.notANumber(s, start, end);
    if (i < end && (c === 101 || c === 69)) {
      c = s.charCodeAt(++i);
      let expNegative = false;
      if (c === 45 || c === 43) {
        expNegative = c === 45;
        c = s.charCodeAt(++i);
      }
      let e = 0;
      let expDigits = 0;
      while (i < end && c >= 48 && c <= 57) {
        if (e < 100000) e = e * 10 + (c - 48);
        expDigits++;
        c = s.charCodeAt(++i);
      }
      if (expDigits === 0) return this.notANumber(s, start, end);
      exponent += expNegative ? -e : e;
    }
    if (i !== end) return this.notANumber(s, start, end);
    this.kind = CELL_NUMBER;
    exponent += shift;
    // readPlainRows (plain-rows.ts) applies the same condition, so both paths give bit-identical values.
    if (mantissa >= EXACT_LIMIT || exponent > 22 || exponent < -22) {
      const raw = s.slice(start, end);
      const text = decimalCode === 46 ? raw : raw.replace(',', '.');
      if (shift === 0) return Number(text);
      return /[eE]/.test(text) ? Number(text) * Number(`1e${shift}`) : Number(`${text}e${shift}`);
    }
    const magnitude = exponent >= 0 ? mantissa * POW10[exponent] : mantissa / POW10[-exponent];
    return negative ? -magnitude : magnitude;
  }

  private notANumber(s: string, start: number, end: number): number {
    const word = s.slice(start, end).toLowerCase();
    if (MISSING_WORDS.has(word)) {
      this.kind = CELL_MISSING;
      return NaN;
    }
    if (word === 'inf' || word === '+inf' || word === 'infinity' || word === '+infinity') {
      this.kind = CELL_NUMBER;
      return Infinity;
    }
    if (word === '-inf' || word === '-infinity') {
      this.kind = CELL_NUMBER;
      return -Infinity;
    }
    this.kind = CELL_TEXT;
    return NaN;
  }
}
