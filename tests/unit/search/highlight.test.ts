import { describe, expect, it } from 'vitest';
import { highlightSegments, SNIPPET_CHARS } from '@/lib/search/highlight';
import { tokenSpans } from '@/lib/search/tokenise';
import type { HighlightSegment } from '@/lib/search/types';

// Expected segments are written out by hand from the input strings.
describe('highlightSegments', () => {
  it('returns undefined when no word matches or there are no terms', () => {
    expect(highlightSegments('Niobium wire', new Set(['copper']))).toBeUndefined();
    expect(highlightSegments('Niobium wire', new Set())).toBeUndefined();
    expect(highlightSegments('', new Set(['wire']))).toBeUndefined();
  });

  it('matches whole words by key (case, accents, plural), not substrings', () => {
    expect(highlightSegments('Wires, wirebond and WIRE', new Set(['wire']))).toEqual([
      { text: 'Wires', match: true },
      { text: ', wirebond and ', match: false },
      { text: 'WIRE', match: true },
    ]);
  });

  it('cuts a long description to a window around the first match, at word boundaries, with ellipses', () => {
    const before = Array.from({ length: 60 }, (_, i) => `alpha${i}`).join(' ');
    const after = Array.from({ length: 60 }, (_, i) => `omega${i}`).join(' ');
    const text = `${before} kondo ${after}`;
    const segments = highlightSegments(text, new Set(['kondo']), SNIPPET_CHARS) ?? [];
    const joined = segments.map((s) => s.text).join('');
    expect(segments[0].text.startsWith('…')).toBe(true);
    expect(segments[segments.length - 1].text.endsWith('…')).toBe(true);
    expect(segments.filter((s) => s.match)).toEqual([{ text: 'kondo', match: true }]);
    expect(joined.length).toBeLessThanOrEqual(SNIPPET_CHARS + 2);
    // Every word in the window is whole: it appears in the original text between spaces.
    for (const word of joined.replace(/…/g, '').trim().split(' ')) expect(` ${text} `).toContain(` ${word} `);
    // About a third of the window precedes the match.
    expect(joined.indexOf('kondo')).toBeGreaterThan(SNIPPET_CHARS / 4);
    expect(joined.indexOf('kondo')).toBeLessThan(SNIPPET_CHARS / 2);
  });

  it('leaves a short description whole', () => {
    expect(highlightSegments('Kondo upturn below 20 K.', new Set(['kondo']), SNIPPET_CHARS)).toEqual([
      { text: 'Kondo', match: true },
      { text: ' upturn below 20 K.', match: false },
    ]);
  });

  it('gives what the plain span-by-span reading gives, on random text and terms', () => {
    // Reference: the same rules written the simple way, over token objects (tokenSpans).
    const reference = (text: string, terms: Set<string>, maxChars?: number): HighlightSegment[] | undefined => {
      const spans = tokenSpans(text);
      const matched = spans.filter((s) => terms.has(s.key));
      if (!text || terms.size === 0 || matched.length === 0) return undefined;
      let from = 0;
      let to = text.length;
      if (maxChars !== undefined && text.length > maxChars) {
        from = Math.max(0, matched[0].start - Math.floor(maxChars / 3));
        to = Math.min(text.length, from + maxChars);
        from = Math.max(0, to - maxChars);
        const startWord = spans.find((s) => s.end > from);
        if (startWord && startWord.start < from) from = startWord.end;
        const endWord = [...spans].reverse().find((s) => s.start < to);
        if (endWord && endWord.end > to) to = endWord.start;
        while (from > 0 && from < to && /\s/.test(text[from])) from++;
        while (to < text.length && to > from && /\s/.test(text[to - 1])) to--;
      }
      const out: HighlightSegment[] = [];
      const add = (part: string, match: boolean) => {
        if (!part) return;
        const last = out[out.length - 1];
        if (last && last.match === match) last.text += part;
        else out.push({ text: part, match });
      };
      if (from > 0) add('…', false);
      let cursor = from;
      for (const span of matched) {
        if (span.start < from || span.end > to) continue;
        add(text.slice(cursor, span.start), false);
        add(text.slice(span.start, span.end), true);
        cursor = span.end;
      }
      add(text.slice(cursor, to), false);
      if (to < text.length) add('…', false);
      return out;
    };
    let seed = 4242;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const words = ['Hall', 'hall', 'halls', 'films', 'film', 'Cu₂O', 'cu2o', '4.2', '42', 'naïve', 'naive', 'ρ(T)', '–', 'kondo', 'x'.repeat(40)];
    for (let n = 0; n < 800; n++) {
      const text = Array.from({ length: Math.floor(next() * 90) }, () => words[Math.floor(next() * words.length)]).join(next() < 0.5 ? ' ' : ', ');
      const terms = new Set(Array.from({ length: Math.floor(next() * 3) }, () => ['hall', 'film', 'cu2o', '42', 'naive', 'kondo', 'x'.repeat(32)][Math.floor(next() * 7)]));
      const max = next() < 0.5 ? SNIPPET_CHARS : undefined;
      expect(highlightSegments(text, terms, max), JSON.stringify({ text, terms: [...terms], max })).toEqual(reference(text, terms, max));
    }
    // Text whose only non-ASCII characters are separators and sub- or superscript digits, with digit-free terms (what
    // most cards carry, read by finding the terms in the lower-cased text): words that contain a term without being
    // it, plurals, long words cut to 32 characters (digits past the cut leave a digit-free key), digits joined across
    // dots, and cuts falling inside words; '𝑥' (a letter outside the first plane, keyed x) must send a text the general way.
    const plain = ['Films', 'FILM', 'filmed', 'microfilm', 'film2', 'film.', '4.2', '1.2.3', '1..2', 'Mn₃Ba', 'x²', 'x².5',
      'hall-bar', 'Hall,', 'resistances', 'Resistance', `${'a'.repeat(31)}s`, 'b'.repeat(40), 'bars', '–', '(bar)', '7.film',
      `${'c'.repeat(32)}7`, `${'c'.repeat(31)}7`, `${'c'.repeat(33)}₂x`, '𝑥'];
    const plainTerms = ['film', 'hall', 'resistance', 'bar', 'mn', 'ba', 'x', 'a'.repeat(31), 'b'.repeat(32), 'micro', 'c'.repeat(32)];
    for (let n = 0; n < 1500; n++) {
      const text = Array.from({ length: Math.floor(next() * 120) }, () => plain[Math.floor(next() * plain.length)])
        .join([' ', ', ', '–', '.', ' – '][Math.floor(next() * 5)]);
      const terms = new Set(Array.from({ length: 1 + Math.floor(next() * 3) }, () => plainTerms[Math.floor(next() * plainTerms.length)]));
      const max = next() < 0.7 ? SNIPPET_CHARS : undefined;
      expect(highlightSegments(text, terms, max), JSON.stringify({ text, terms: [...terms], max })).toEqual(reference(text, terms, max));
    }
  });
});
