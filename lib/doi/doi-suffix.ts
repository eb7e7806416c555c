import { randomInt } from 'node:crypto';

// Crockford's base32 (crockford.com/base32.html) in lower case: digits and letters without i, l, o, u.
export const CROCKFORD_ALPHABET = '0123456789abcdefghjkmnpqrstvwxyz';

/** Matches the suffixes Ohmstead mints: "ohm." then two groups of four Crockford characters. */
export const OHM_SUFFIX_PATTERN = /^ohm\.[0-9a-hjkmnp-tv-z]{4}-[0-9a-hjkmnp-tv-z]{4}$/;

/** A fresh DOI suffix such as "ohm.7k2m-q9xd": 40 random bits, so collisions are negligible (~1e12 choices). */
export function newDoiSuffix(pick: (n: number) => number = randomInt): string {
  const group = () => Array.from({ length: 4 }, () => CROCKFORD_ALPHABET[pick(CROCKFORD_ALPHABET.length)]).join('');
  return `ohm.${group()}-${group()}`;
}

/** A full DOI under the repository's prefix; DOIs are case-insensitive and kept lower-case (DOI Handbook). */
export function newDoi(prefix: string): string {
  return `${prefix.toLowerCase()}/${newDoiSuffix()}`;
}
