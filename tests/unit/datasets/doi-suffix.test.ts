// Our DOI suffix format (issue 4): "ohm." + 8 Crockford base32 characters in two groups of four.
// Alphabet from Crockford's base32 definition (crockford.com/base32.html): 0-9 and A-Z without I, L, O, U.
import { describe, expect, it } from 'vitest';
import { CROCKFORD_ALPHABET, OHM_SUFFIX_PATTERN, newDoi, newDoiSuffix } from '@/lib/doi/doi-suffix';

describe('DOI suffixes', () => {
  it('uses the 32 Crockford symbols, lower-case, without i, l, o, u', () => {
    expect(CROCKFORD_ALPHABET).toHaveLength(32);
    expect(new Set(CROCKFORD_ALPHABET).size).toBe(32);
    for (const c of 'ilou') expect(CROCKFORD_ALPHABET).not.toContain(c);
    expect(CROCKFORD_ALPHABET).toBe('0123456789abcdefghjkmnpqrstvwxyz');
  });

  it('maps each pick to its symbol, in two groups of four', () => {
    const picks = [0, 31, 10, 17, 18, 20, 21, 27]; // 0 z a h j m n v by counting through the alphabet
    let i = 0;
    expect(newDoiSuffix(() => picks[i++]!)).toBe('ohm.0zah-jmnv');
    expect(newDoiSuffix(() => 0)).toBe('ohm.0000-0000');
  });

  it('draws fresh random suffixes that match the pattern and cover the alphabet', () => {
    const suffixes = Array.from({ length: 2000 }, () => newDoiSuffix());
    for (const s of suffixes) expect(s).toMatch(OHM_SUFFIX_PATTERN);
    expect(new Set(suffixes).size).toBe(2000); // 2000 draws from 32^8 ≈ 1.1e12: a repeat would be a bug
    const seen = new Set(suffixes.join('').replace(/ohm\.|-/g, ''));
    expect(seen.size).toBe(32);
  });

  it('rejects look-alike letters in the pattern', () => {
    expect('ohm.7k2m-q9xd').toMatch(OHM_SUFFIX_PATTERN);
    expect('ohm.7k2m-q9xo').not.toMatch(OHM_SUFFIX_PATTERN);
    expect('ohm.7k2m-q9xdd').not.toMatch(OHM_SUFFIX_PATTERN);
    expect('ohm.7K2M-Q9XD').not.toMatch(OHM_SUFFIX_PATTERN);
  });

  it('puts the suffix under the (lower-cased) prefix', () => {
    expect(newDoi('10.80123')).toMatch(/^10\.80123\/ohm\.[0-9a-hjkmnp-tv-z]{4}-[0-9a-hjkmnp-tv-z]{4}$/);
  });
});
