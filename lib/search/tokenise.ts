// One tokeniser for indexing, querying and highlighting, so the three always agree on what a word is.

/** Longer words are cut to this many characters (index and query alike), which bounds index memory. */
export const MAX_TERM_CHARS = 32;

// A word is a run of letters, digits (incl. ₀–₉) and marks; a dot between digits stays inside (La0.7Sr0.3MnO3, 4.2).
// As a regex: /[\p{L}\p{N}\p{M}]+(?:(?<=\p{N})\.(?=\p{N})[\p{L}\p{N}\p{M}]+)*/gu — scan() below reads the same words.
const ASCII = /^[\x00-\x7f]*$/;

// Frequent English words that would only bloat the index; element symbols (In, As, Be, At) are kept in the formula fields.
export const STOPWORDS: ReadonlySet<string> = new Set(
  ('a an and are as at be by for from has have in into is it its of on or our that the their this to was were which with we')
    .split(' '),
);

/** Normalised key of one word: compatibility forms folded (₂ → 2), accents and case dropped, inner dots removed, plural -s dropped. */
export function termKey(word: string): string {
  const key = ASCII.test(word)
    ? word.toLowerCase().replace(/[^a-z0-9]/g, '')
    : word.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');
  return finishKey(key);
}

// Cut to MAX_TERM_CHARS, then the plain English plural: letters-only words of 5+ characters (films → film), except
// -ss, -us, -is; formulas and short symbols stay whole. (Char codes instead of regexes: this runs for every word indexed.)
function finishKey(key: string): string {
  if (key.length > MAX_TERM_CHARS) key = key.slice(0, MAX_TERM_CHARS);
  const n = key.length;
  if (n < 5 || key.charCodeAt(n - 1) !== 115) return key;
  const before = key.charCodeAt(n - 2);
  if (before === 115 || before === 117 || before === 105) return key; // -ss, -us, -is
  for (let i = 0; i < n; i++) {
    const c = key.charCodeAt(i);
    if (c < 97 || c > 122) return key;
  }
  return key.slice(0, -1);
}

export type TokenSpan = { start: number; end: number; key: string };

/** Every word of `text` with its position in the original string and its key. */
export function tokenSpans(text: string): TokenSpan[] {
  const keys: string[] = [];
  const starts: number[] = [];
  const ends: number[] = [];
  scan(text, keys, starts, ends);
  return keys.map((key, i) => ({ start: starts[i], end: ends[i], key }));
}

/** Keys of the words of `text` in order, stopwords left out: what a text field indexes and what a text query looks up. */
export function textKeys(text: string): string[] {
  const keys: string[] = [];
  scan(text, keys, null, null);
  return keys.filter((key) => !STOPWORDS.has(key));
}

/** Appends to `out` the keys of `text` that are not stopwords and not yet in `seen` (adding them to it). */
export function addNewKeys(text: string, seen: Set<string>, out: string[]): void {
  const keys: string[] = [];
  scan(text, keys, null, null);
  for (const key of keys) {
    if (STOPWORDS.has(key) || seen.has(key)) continue;
    seen.add(key);
    out.push(key);
  }
}

// Word characters: letters, digits (₀–₉ included) and marks; tested by regex only for non-ASCII ones.
const WORD_CHAR = /^[\p{L}\p{N}\p{M}]$/u;
const DIGIT_CHAR = /^\p{N}$/u;

/** Width in UTF-16 units of the word character at i (2 for one outside the BMP), or 0 if it is not one. */
function wordCharAt(text: string, i: number): number {
  const c = text.charCodeAt(i);
  if (c < 128) return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || (c >= 48 && c <= 57) ? 1 : 0;
  const width = c >= 0xd800 && c <= 0xdbff && i + 1 < text.length ? 2 : 1;
  return WORD_CHAR.test(text.slice(i, i + width)) ? width : 0;
}

function digitAt(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  if (c < 128) return c >= 48 && c <= 57;
  const width = c >= 0xd800 && c <= 0xdbff ? 2 : 1;
  return DIGIT_CHAR.test(text.slice(i, i + width));
}

// The words of WORD in one pass over char codes (no regex over the whole text): a run of word characters, continued
// across a dot between two digits. ASCII words are keyed inline; the rest go through termKey's Unicode folding.
function scan(text: string, keys: string[], starts: number[] | null, ends: number[] | null): void {
  if (ASCII.test(text)) {
    scanAscii(text.toLowerCase(), keys, starts, ends);
    return;
  }
  const n = text.length;
  let i = 0;
  while (i < n) {
    const width = wordCharAt(text, i);
    if (width === 0) {
      i += text.charCodeAt(i) >= 0xd800 && text.charCodeAt(i) <= 0xdbff ? 2 : 1;
      continue;
    }
    const start = i;
    let ascii = true;
    let dotted = false;
    let last = i;
    while (i < n) {
      const w = wordCharAt(text, i);
      if (w > 0) {
        if (text.charCodeAt(i) >= 128) ascii = false;
        last = i;
        i += w;
      } else if (text.charCodeAt(i) === 46 && i + 1 < n && digitAt(text, last) && digitAt(text, i + 1)) {
        dotted = true;
        i++;
      } else break;
    }
    const word = text.slice(start, i);
    const key = ascii ? finishKey((dotted ? word.replace(/\./g, '') : word).toLowerCase()) : termKey(word);
    if (!key) continue;
    keys.push(key);
    starts?.push(start);
    ends?.push(i);
  }
}

// The same for ASCII text, lower-cased once up front: [a-z0-9] runs joined across a dot between two digits.
function scanAscii(text: string, keys: string[], starts: number[] | null, ends: number[] | null): void {
  const n = text.length;
  let i = 0;
  while (i < n) {
    let c = text.charCodeAt(i);
    if (!((c >= 97 && c <= 122) || (c >= 48 && c <= 57))) {
      i++;
      continue;
    }
    const start = i;
    let dotted = false;
    while (i < n) {
      c = text.charCodeAt(i);
      if ((c >= 97 && c <= 122) || (c >= 48 && c <= 57)) i++;
      else if (c === 46 && i + 1 < n && isDigit(text.charCodeAt(i - 1)) && isDigit(text.charCodeAt(i + 1))) {
        dotted = true;
        i++;
      } else break;
    }
    const word = text.slice(start, i);
    keys.push(finishKey(dotted ? word.replace(/\./g, '') : word));
    starts?.push(start);
    ends?.push(i);
  }
}

const isDigit = (c: number) => c >= 48 && c <= 57;

/** Splits an already-keyed, space-separated field (formula keys, element symbols) without touching the keys. */
export function spaceKeys(text: string): string[] {
  return text === '' ? [] : text.split(' ');
}
