// Marks the words a query matched as plain segments (never HTML), so a card can render them without injecting markup.
import { finishKey, MAX_TERM_CHARS, tokenArrays } from './tokenise';
import type { HighlightSegment } from './types';

/** Characters of description shown around the first match. */
export const SNIPPET_CHARS = 240;
const ELLIPSIS = '…';

/** The words of a text that a query matched (start and end offsets, in text order), and the text's word boundaries. */
interface Matched {
  readonly starts: number[];
  readonly ends: number[];
  /** The word with start < at < end (a cut at `at` would split it), or null. */
  wordAcross(at: number): { start: number; end: number } | null;
}

/**
 * Splits `text` into segments, marking every word whose key is one of `terms` (keys from the same tokeniser).
 * Returns undefined when nothing matches. With `maxChars`, returns a window of about that length around the first
 * match, cut at word boundaries and marked with an ellipsis where text was left out.
 */
export function highlightSegments(
  text: string,
  terms: ReadonlySet<string>,
  maxChars?: number,
): HighlightSegment[] | undefined {
  if (!text || terms.size === 0) return undefined;
  const matched = PlainText.match(text, terms) ?? ScannedText.match(text, terms);
  if (matched.starts.length === 0) return undefined;
  const { starts, ends } = matched;

  let from = 0;
  let to = text.length;
  if (maxChars !== undefined && text.length > maxChars) {
    from = Math.max(0, starts[0] - Math.floor(maxChars / 3));
    to = Math.min(text.length, from + maxChars);
    from = Math.max(0, to - maxChars);
    // Move the cut points onto word boundaries so no word is split.
    const atFrom = matched.wordAcross(from);
    if (atFrom) from = atFrom.end;
    const atTo = matched.wordAcross(to);
    if (atTo) to = atTo.start;
    // Drop whitespace at a cut so the snippet reads cleanly next to the ellipsis.
    while (from > 0 && from < to && /\s/.test(text[from])) from++;
    while (to < text.length && to > from && /\s/.test(text[to - 1])) to--;
  }

  const segments: HighlightSegment[] = [];
  if (from > 0) push(segments, ELLIPSIS, false);
  let cursor = from;
  for (let w = 0; w < starts.length && starts[w] < to; w++) {
    if (starts[w] < from || ends[w] > to) continue;
    push(segments, text.slice(cursor, starts[w]), false);
    push(segments, text.slice(starts[w], ends[w]), true);
    cursor = ends[w];
  }
  push(segments, text.slice(cursor, to), false);
  if (to < text.length) push(segments, ELLIPSIS, false);
  return segments;
}

// Appends a part, merging it into the previous segment when both are matches or both are not.
function push(segments: HighlightSegment[], part: string, match: boolean): void {
  if (!part) return;
  const last = segments[segments.length - 1];
  if (last && last.match === match) last.text += part;
  else segments.push({ text: part, match });
}

// --- the general way: every word of the text, keyed by the tokeniser ----------------------------------------------
// For what the quick way below declines: text with other non-ASCII letters or digits, or a term with a digit.

class ScannedText implements Matched {
  readonly starts: number[] = [];
  readonly ends: number[] = [];

  private constructor(private readonly words: { keys: string[]; starts: number[]; ends: number[] }, terms: ReadonlySet<string>) {
    for (let w = 0; w < words.keys.length; w++) {
      if (!terms.has(words.keys[w])) continue;
      this.starts.push(words.starts[w]);
      this.ends.push(words.ends[w]);
    }
  }

  static match(text: string, terms: ReadonlySet<string>): ScannedText {
    // Words as parallel arrays (keys, starts, ends): the text is scanned once, without an object per word, and only
    // words that could have a term's length are keyed.
    return new ScannedText(tokenArrays(text, new Set([...terms].map((term) => term.length))), terms);
  }

  wordAcross(at: number): { start: number; end: number } | null {
    const { starts, ends } = this.words;
    let lo = 0, hi = ends.length; // the first word ending after `at`
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (ends[mid] <= at) lo = mid + 1;
      else hi = mid;
    }
    return lo < ends.length && starts[lo] < at ? { start: starts[lo], end: ends[lo] } : null;
  }
}

// --- the quick way: find each term in the lower-cased text, then check the word it starts -------------------------
// Exact for the texts most cards carry: terms without digits, and text whose only non-ASCII characters are
// separators (–, °, ·) or sub- and superscript digits. There a word is a run of [a-z0-9] (or those digits) joined
// across a dot between two digits, as the tokeniser reads it, and a digit-free key is the word's lower-cased letters
// (cut to MAX_TERM_CHARS, less a plural -s): so it starts where the word starts, and indexOf finds every candidate.

const NON_ASCII = /[^\x00-\x7f]/;
const DIGIT = /\d/;
const WORD_CHAR = /^[\p{L}\p{N}\p{M}]$/u;
const isScriptDigit = (c: number) => c === 0xb2 || c === 0xb3 || c === 0xb9 || c === 0x2070 || (c >= 0x2074 && c <= 0x2079) || (c >= 0x2080 && c <= 0x2089);
const isDigitCode = (c: number) => (c >= 48 && c <= 57) || isScriptDigit(c);
const isLetterCode = (c: number) => c >= 97 && c <= 122;

class PlainText implements Matched {
  readonly starts: number[] = [];
  readonly ends: number[] = [];

  private constructor(private readonly lower: string, terms: ReadonlySet<string>) {
    for (const term of terms) {
      for (let at = lower.indexOf(term); at !== -1; at = lower.indexOf(term, at + 1)) {
        if (this.inWord(at - 1)) continue; // inside a word, not at its start
        let end = at;
        let firstDigit = -1;
        while (this.inWord(end)) {
          if (firstDigit < 0 && !isLetterCode(lower.charCodeAt(end))) firstDigit = end;
          end++;
        }
        // The key keeps the word's digits unless they all lie beyond the cut at MAX_TERM_CHARS; the letters before
        // them key as they are.
        const letters = firstDigit < 0 ? end : firstDigit - at >= MAX_TERM_CHARS ? firstDigit : -1;
        if (letters >= 0 && finishKey(lower.slice(at, letters)) === term) {
          this.starts.push(at);
          this.ends.push(end);
        }
      }
    }
    if (terms.size > 1) this.sort();
  }

  /** The matched words, or null when the text or a term is outside the quick way's reach. */
  static match(text: string, terms: ReadonlySet<string>): PlainText | null {
    for (const term of terms) if (DIGIT.test(term)) return null;
    if (!separatorsBeyondAscii(text)) return null;
    const lower = text.toLowerCase();
    return lower.length === text.length ? new PlainText(lower, terms) : null;
  }

  wordAcross(at: number): { start: number; end: number } | null {
    if (!this.inWord(at - 1) || !this.inWord(at)) return null;
    let start = at - 1;
    while (this.inWord(start - 1)) start--;
    let end = at + 1;
    while (this.inWord(end)) end++;
    return { start, end };
  }

  // Part of a word at i: a letter or digit, or a dot between two digits.
  private inWord(i: number): boolean {
    const { lower } = this;
    if (i < 0 || i >= lower.length) return false;
    const c = lower.charCodeAt(i);
    return isLetterCode(c) || isDigitCode(c) || (c === 46 && isDigitCode(lower.charCodeAt(i - 1)) && isDigitCode(lower.charCodeAt(i + 1)));
  }

  // Puts the words of several terms in text order (they never overlap: a word has one key).
  private sort(): void {
    const { starts, ends } = this;
    let sorted = true;
    for (let i = 1; i < starts.length && sorted; i++) sorted = starts[i - 1] < starts[i];
    if (sorted) return;
    const order = starts.map((_, i) => i).sort((a, b) => starts[a] - starts[b]);
    const [s, e] = [starts.slice(), ends.slice()];
    order.forEach((from, to) => {
      starts[to] = s[from];
      ends[to] = e[from];
    });
  }
}

// Whether every non-ASCII character of `text` is a separator or a sub- or superscript digit (a surrogate pair, which
// could be a letter outside the first plane, sends the text the general way).
function separatorsBeyondAscii(text: string): boolean {
  const first = text.search(NON_ASCII);
  if (first === -1) return true;
  for (let i = first; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 128 || isScriptDigit(c)) continue;
    if ((c >= 0xd800 && c <= 0xdfff) || WORD_CHAR.test(text[i])) return false;
  }
  return true;
}
