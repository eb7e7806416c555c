// One tokeniser for indexing, querying and highlighting, so the three always agree on what a word is.
//
// It is written as one self-contained function, makeTokeniser, that refers to nothing outside itself: its source text
// (Function.prototype.toString) also runs on the worker thread that keys a rebuild's text (key-worker.ts), whatever
// bundler or loader compiled this file. Keep it so: no imports, no module-level names inside it.

export type TokenSpan = { start: number; end: number; key: string };

export function makeTokeniser() {
  /** Longer words are cut to this many characters (index and query alike), which bounds index memory. */
  const MAX_TERM_CHARS = 32;

  // A word is a run of letters, digits (incl. ₀–₉) and marks; a dot between digits stays inside (La0.7Sr0.3MnO3, 4.2).
  // As a regex: /[\p{L}\p{N}\p{M}]+(?:(?<=\p{N})\.(?=\p{N})[\p{L}\p{N}\p{M}]+)*/gu — scan() below reads the same words.
  const ASCII = /^[\x00-\x7f]*$/;

  // Frequent English words that would only bloat the index; element symbols (In, As, Be, At) are kept in the formula fields.
  const STOPWORDS: ReadonlySet<string> = new Set(
    ('a an and are as at be by for from has have in into is it its of on or our that the their this to was were which with we')
      .split(' '),
  );

  /** Normalised key of one word: compatibility forms folded (₂ → 2), accents and case dropped, inner dots removed, plural -s dropped. */
  function termKey(word: string): string {
    const key = ASCII.test(word)
      ? word.toLowerCase().replace(/[^a-z0-9]/g, '')
      : word.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');
    return finishKey(key);
  }

  /**
   * A lower-cased word's key: cut to MAX_TERM_CHARS, then the plain English plural dropped from letters-only words of 5+
   * characters (films → film), except -ss, -us, -is; formulas and short symbols stay whole. (Char codes instead of
   * regexes: this runs for every word indexed.)
   */
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


  /** Every word of `text` with its position in the original string and its key. */
  function tokenSpans(text: string): TokenSpan[] {
    const keys: string[] = [];
    const starts: number[] = [];
    const ends: number[] = [];
    scan(text, keys, starts, ends);
    return keys.map((key, i) => ({ start: starts[i], end: ends[i], key }));
  }

  /**
   * tokenSpans as three parallel arrays (no object per word). With `keyLengths`, an ASCII word whose key cannot have one
   * of those lengths gets the key '' (it is not keyed at all): a caller looking for a few known keys skips the rest.
   */
  function tokenArrays(text: string, keyLengths?: ReadonlySet<number>): { keys: string[]; starts: number[]; ends: number[] } {
    const keys: string[] = [];
    const starts: number[] = [];
    const ends: number[] = [];
    scan(text, keys, starts, ends, keyLengths ?? null);
    return { keys, starts, ends };
  }

  // Whether an ASCII word of `chars` characters (dots removed) can have a key of one of `lengths`: its key is the word
  // cut to MAX_TERM_CHARS, less a plural -s (finishKey).
  function mayHaveKeyLength(chars: number, lengths: ReadonlySet<number>): boolean {
    const cut = Math.min(chars, MAX_TERM_CHARS);
    return lengths.has(cut) || lengths.has(cut - 1);
  }

  /** Keys of the words of `text` in order, stopwords left out: what a text field indexes and what a text query looks up. */
  function textKeys(text: string): string[] {
    const keys: string[] = [];
    scan(text, keys, null, null);
    return keys.filter((key) => !isStopword(key));
  }

  /** Appends the keys of `text` that are not stopwords to `out` (textKeys without a new array). */
  function addKeys(text: string, out: string[]): void {
    const start = out.length;
    scan(text, out, null, null);
    let kept = start;
    for (let i = start; i < out.length; i++) if (!isStopword(out[i])) out[kept++] = out[i];
    out.length = kept;
  }

  // Keys longer than the longest stopword skip the set lookup.
  const STOPWORD_MAX = Math.max(...[...STOPWORDS].map((w) => w.length));
  const isStopword = (key: string) => key.length <= STOPWORD_MAX && STOPWORDS.has(key);

  // Word characters: letters, digits (₀–₉ included) and marks; tested by regex only for non-ASCII ones.
  const WORD_CHAR = /^[\p{L}\p{N}\p{M}]$/u;
  const DIGIT_CHAR = /^\p{N}$/u;
  const isAsciiWord = (c: number) => (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || (c >= 48 && c <= 57);
  const isDigit = (c: number) => c >= 48 && c <= 57;
  const isHighSurrogate = (c: number) => c >= 0xd800 && c <= 0xdbff;

  /** Width in UTF-16 units (1, or 2 outside the BMP) of the non-ASCII word character at i, or 0 if it is not one. */
  function unicodeWordAt(text: string, i: number): number {
    const width = isHighSurrogate(text.charCodeAt(i)) && i + 1 < text.length ? 2 : 1;
    return WORD_CHAR.test(text.slice(i, i + width)) ? width : 0;
  }

  function digitAt(text: string, i: number): boolean {
    const c = text.charCodeAt(i);
    if (c < 128) return isDigit(c);
    return DIGIT_CHAR.test(text.slice(i, i + (isHighSurrogate(c) ? 2 : 1)));
  }

  // The words of WORD in one pass over char codes (no regex over the whole text): a run of word characters, continued
  // across a dot between two digits. ASCII characters are classified inline; only others go through a regex test.
  function scan(text: string, keys: string[], starts: number[] | null, ends: number[] | null, lengths: ReadonlySet<number> | null = null): void {
    if (ASCII.test(text)) {
      scanAscii(text.toLowerCase(), keys, starts, ends, lengths);
      return;
    }
    const n = text.length;
    let i = 0;
    while (i < n) {
      const c = text.charCodeAt(i);
      const width = c < 128 ? (isAsciiWord(c) ? 1 : 0) : unicodeWordAt(text, i);
      if (width === 0) {
        i += isHighSurrogate(c) && i + 1 < n ? 2 : 1;
        continue;
      }
      const start = i;
      let ascii = true;
      let dots = 0;
      let last = i;
      while (i < n) {
        const d = text.charCodeAt(i);
        if (d < 128) {
          if (isAsciiWord(d)) {
            last = i++;
            continue;
          }
          if (d === 46 && i + 1 < n && digitAt(text, last) && digitAt(text, i + 1)) {
            dots++;
            i++;
            continue;
          }
          break;
        }
        const w = unicodeWordAt(text, i);
        if (w === 0) break;
        ascii = false;
        last = i;
        i += w;
      }
      let key = '';
      if (!ascii) key = termKey(text.slice(start, i));
      else if (!lengths || mayHaveKeyLength(i - start - dots, lengths)) {
        const word = text.slice(start, i);
        key = finishKey((dots ? word.replace(/\./g, '') : word).toLowerCase());
      }
      if (!key && !ascii) continue;
      keys.push(key);
      starts?.push(start);
      ends?.push(i);
    }
  }

  // The same for ASCII text, lower-cased once up front: [a-z0-9] runs joined across a dot between two digits.
  function scanAscii(text: string, keys: string[], starts: number[] | null, ends: number[] | null, lengths: ReadonlySet<number> | null): void {
    const n = text.length;
    let i = 0;
    while (i < n) {
      let c = text.charCodeAt(i);
      if (!((c >= 97 && c <= 122) || (c >= 48 && c <= 57))) {
        i++;
        continue;
      }
      const start = i;
      let dots = 0;
      while (i < n) {
        c = text.charCodeAt(i);
        if ((c >= 97 && c <= 122) || (c >= 48 && c <= 57)) i++;
        else if (c === 46 && i + 1 < n && isDigit(text.charCodeAt(i - 1)) && isDigit(text.charCodeAt(i + 1))) {
          dots++;
          i++;
        } else break;
      }
      if (lengths && !mayHaveKeyLength(i - start - dots, lengths)) keys.push('');
      else {
        const word = text.slice(start, i);
        keys.push(finishKey(dots ? word.replace(/\./g, '') : word));
      }
      starts?.push(start);
      ends?.push(i);
    }
  }

  /** Splits an already-keyed, space-separated field (formula keys, element symbols) without touching the keys. */
  function spaceKeys(text: string): string[] {
    return text === '' ? [] : text.split(' ');
  }

  return { MAX_TERM_CHARS, STOPWORDS, termKey, finishKey, tokenSpans, tokenArrays, textKeys, addKeys, spaceKeys };
}

export const { MAX_TERM_CHARS, STOPWORDS, termKey, finishKey, tokenSpans, tokenArrays, textKeys, addKeys, spaceKeys } =
  makeTokeniser();
