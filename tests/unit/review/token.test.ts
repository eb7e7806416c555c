// Reviewer-link tokens: format, entropy, hashing and the constant-time compare (issue 6 "Bad input and faults").
import { describe, expect, it } from 'vitest';
import { generateReviewToken, hashesMatch, hashReviewToken, NO_MATCH_HASH, REVIEW_TOKEN_BYTES, REVIEW_TOKEN_PATTERN } from '@/lib/review/token';

describe('generateReviewToken', () => {
  it('is 32 random bytes as unpadded base64url: 43 URL-safe characters, 256 bits', () => {
    const token = generateReviewToken();
    expect(REVIEW_TOKEN_BYTES * 8).toBe(256);
    expect(token).toMatch(REVIEW_TOKEN_PATTERN);
    expect(token).toHaveLength(43);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    expect(encodeURIComponent(token)).toBe(token);
  });

  it('never repeats in 2000 draws and uses the whole alphabet', () => {
    const tokens = Array.from({ length: 2000 }, generateReviewToken);
    expect(new Set(tokens).size).toBe(2000);
    const seen = new Set(tokens.join(''));
    expect(seen.size).toBe(64); // 86 000 characters drawn from 64 symbols: every symbol shows up
  });
});

describe('hashReviewToken', () => {
  it('is SHA-256 of the UTF-8 bytes in lower-case hex (FIPS 180-4: SHA-256("abc"))', () => {
    expect(hashReviewToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('gives 64 hex characters for any input, empty and huge included', () => {
    for (const input of ['', 'x', generateReviewToken(), 'ü'.repeat(10_000)]) expect(hashReviewToken(input)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('changes completely when one character of the token changes', () => {
    const token = generateReviewToken();
    const tampered = token.slice(0, 20) + (token[20] === 'A' ? 'B' : 'A') + token.slice(21);
    expect(hashReviewToken(tampered)).not.toBe(hashReviewToken(token));
    expect(hashReviewToken(token.slice(0, 42))).not.toBe(hashReviewToken(token));
  });
});

describe('hashesMatch (crypto.timingSafeEqual over the 32 digest bytes)', () => {
  const token = generateReviewToken();
  const stored = hashReviewToken(token);

  it('accepts only the exact digest', () => {
    expect(hashesMatch(hashReviewToken(token), stored)).toBe(true);
    const flipped = stored.slice(0, 63) + (stored[63] === '0' ? '1' : '0');
    expect(hashesMatch(flipped, stored)).toBe(false);
  });

  it('refuses truncated, upper-case, non-hex and empty digests without throwing', () => {
    expect(hashesMatch(stored.slice(0, 62), stored)).toBe(false);
    expect(hashesMatch(stored.toUpperCase(), stored)).toBe(false);
    expect(hashesMatch('z'.repeat(64), stored)).toBe(false);
    expect(hashesMatch('', stored)).toBe(false);
    expect(hashesMatch(stored, '')).toBe(false);
  });

  it('a miss compared against the stand-in digest is refused', () => {
    expect(hashesMatch(stored, NO_MATCH_HASH)).toBe(false);
    expect(NO_MATCH_HASH).toMatch(/^0{64}$/);
  });
});
