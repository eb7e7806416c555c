import { describe, expect, it } from 'vitest';
import { highlightSegments, SNIPPET_CHARS } from '@/lib/search/highlight';

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
});
