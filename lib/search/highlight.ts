// Marks the words a query matched as plain segments (never HTML), so a card can render them without injecting markup.
import { tokenSpans } from './tokenise';
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
  const spans = tokenSpans(text);
  const matched = spans.filter((s) => terms.has(s.key));
  if (matched.length === 0) return undefined;

  let from = 0;
  let to = text.length;
  if (maxChars !== undefined && text.length > maxChars) {
    const first = matched[0];
    from = Math.max(0, first.start - Math.floor(maxChars / 3));
    to = Math.min(text.length, from + maxChars);
    from = Math.max(0, to - maxChars);
    // Move the cut points onto word boundaries so no word is split.
    const startWord = spans.find((s) => s.end > from);
    if (startWord && startWord.start < from) from = startWord.end;
    const endWord = [...spans].reverse().find((s) => s.start < to);
    if (endWord && endWord.end > to) to = endWord.start;
    // Drop whitespace at a cut so the snippet reads cleanly next to the ellipsis.
    while (from > 0 && from < to && /\s/.test(text[from])) from++;
    while (to < text.length && to > from && /\s/.test(text[to - 1])) to--;
  }

  const segments: HighlightSegment[] = [];
  if (from > 0) push(segments, ELLIPSIS, false);
  let cursor = from;
  for (const span of matched) {
    if (span.start < from || span.end > to) continue;
    push(segments, text.slice(cursor, span.start), false);
    push(segments, text.slice(span.start, span.end), true);
    cursor = span.end;
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
