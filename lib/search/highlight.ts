// Marks the words a query matched as plain segments (never HTML), so a card can render them without injecting markup.
import { tokenArrays } from './tokenise';
import type { HighlightSegment } from './types';

/** Characters of description shown around the first match. */
export const SNIPPET_CHARS = 240;
const ELLIPSIS = '…';

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
  if (!text || terms.size === 0 || cannotMatch(text, terms)) return undefined;
  // Words as parallel arrays (keys, starts, ends): a card's text is scanned once, without an object per word, and
  // only words that could have a term's length are keyed.
  const { keys, starts, ends } = tokenArrays(text, new Set([...terms].map((term) => term.length)));
  let first = 0;
  while (first < keys.length && !terms.has(keys[first])) first++;
  if (first === keys.length) return undefined;

  let from = 0;
  let to = text.length;
  if (maxChars !== undefined && text.length > maxChars) {
    from = Math.max(0, starts[first] - Math.floor(maxChars / 3));
    to = Math.min(text.length, from + maxChars);
    from = Math.max(0, to - maxChars);
    // Move the cut points onto word boundaries so no word is split.
    let w = 0;
    while (w < keys.length && ends[w] <= from) w++; // the first word ending after the cut
    if (w < keys.length && starts[w] < from) from = ends[w];
    w = keys.length - 1;
    while (w >= 0 && starts[w] >= to) w--; // the last word starting before the cut
    if (w >= 0 && ends[w] > to) to = starts[w];
    // Drop whitespace at a cut so the snippet reads cleanly next to the ellipsis.
    while (from > 0 && from < to && /\s/.test(text[from])) from++;
    while (to < text.length && to > from && /\s/.test(text[to - 1])) to--;
  }

  const segments: HighlightSegment[] = [];
  if (from > 0) push(segments, ELLIPSIS, false);
  let cursor = from;
  for (let w = first; w < keys.length && starts[w] < to; w++) {
    if (starts[w] < from || ends[w] > to || !terms.has(keys[w])) continue;
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

// Cheap exact pre-check for ASCII text: a key without digits can only be a word of the text if it is a substring of the
// lower-cased text (keys with digits may come from "4.2" → 42, so they always take the full path).
function cannotMatch(text: string, terms: ReadonlySet<string>): boolean {
  if (!/^[\x00-\x7f]*$/.test(text)) return false;
  const lower = text.toLowerCase();
  for (const term of terms) if (/\d/.test(term) || lower.includes(term)) return false;
  return true;
}
