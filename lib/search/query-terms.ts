// Turns the free text of a query into the keys to look up: formulas kept whole (even when typed with spaces),
// common words dropped, the text and the number of words bounded. Every key comes from the index's own tokeniser.
import { ELEMENTS, formulaKey } from './normalise-formula';
import { STOPWORDS, termKey, tokenSpans } from './tokenise';

/** Longer search text is cut here (with a note): no sensible search is longer, and the cost stays bounded. */
export const MAX_QUERY_CHARS = 200;
/** Words looked up at most (all must match); further words are ignored with a note. */
export const MAX_QUERY_TERMS = 12;
/** A formula typed with spaces ("YBa2 Cu3 O7") is recognised across at most this many words. */
const MAX_FORMULA_WORDS = 4;

export type QueryTerms = { terms: string[]; notes: string[] };

/** `isFormula(key)` says whether the index knows a material by that formula key (or alias). */
export function queryTerms(q: string | undefined, isFormula: (key: string) => boolean): QueryTerms {
  const notes: string[] = [];
  let text = (q ?? '').trim();
  if (text.length > MAX_QUERY_CHARS) {
    // Cut by code points so a character outside the BMP is never split.
    text = Array.from(text.slice(0, MAX_QUERY_CHARS * 2)).slice(0, MAX_QUERY_CHARS).join('');
    notes.push(`The search text was shortened to its first ${MAX_QUERY_CHARS} characters.`);
  }
  const words = text.split(/\s+/).filter(Boolean);
  const terms: string[] = [];
  for (let i = 0; i < words.length; ) {
    const run = formulaRun(words, i, isFormula);
    if (run) {
      terms.push(run.key);
      i += run.words;
      continue;
    }
    for (const span of tokenSpans(words[i])) {
      const raw = words[i].slice(span.start, span.end);
      // "in", "as", "at", "be" are common words unless written as the element symbol (In, As, At, Be).
      if (STOPWORDS.has(span.key) && !ELEMENTS.has(raw)) continue;
      terms.push(span.key);
    }
    i++;
  }
  const unique = [...new Set(terms)];
  if (unique.length > MAX_QUERY_TERMS) {
    notes.push(`Only the first ${MAX_QUERY_TERMS} words were searched.`);
    unique.length = MAX_QUERY_TERMS;
  }
  if (text && unique.length === 0) notes.push('The search text has no words to look for, so every version is listed.');
  return { terms: unique, notes };
}

/** The longest run of words starting at `i` whose joined formula key names a known material. */
function formulaRun(words: string[], i: number, isFormula: (key: string) => boolean): { key: string; words: number } | null {
  for (let n = Math.min(MAX_FORMULA_WORDS, words.length - i); n >= 1; n--) {
    const joined = words.slice(i, i + n).join('');
    // A lone common word is a formula only when written as the symbol ("In", not "in").
    if (n === 1 && STOPWORDS.has(termKey(joined)) && !ELEMENTS.has(joined)) return null;
    const key = formulaKey(joined);
    if (key && isFormula(key)) return { key, words: n };
  }
  return null;
}
