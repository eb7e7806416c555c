import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

// Reviewer-link tokens: 256 random bits shown once; the database keeps only their SHA-256.

/** 32 bytes = 256 bits, well over the 128 bits a guessable secret needs (OWASP Session Management: ≥ 64 bits of entropy). */
export const REVIEW_TOKEN_BYTES = 32;
/** base64url of 32 bytes, unpadded: 43 characters of [A-Za-z0-9_-]. */
export const REVIEW_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** A fresh token for the reviewer's URL; never stored or logged. */
export function generateReviewToken(): string {
  return randomBytes(REVIEW_TOKEN_BYTES).toString('base64url');
}

/** What the database stores and looks up: SHA-256 of the token's UTF-8 bytes, lower-case hex (64 characters). */
export function hashReviewToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Stands in for the stored hash when no row matched, so a miss does the same compare as a hit. */
export const NO_MATCH_HASH = '0'.repeat(64);

/**
 * Constant-time equality of two SHA-256 hex digests (crypto.timingSafeEqual). Anything that is not 64 hex
 * characters is compared as the all-zero digest and then refused, so the work is the same for every input.
 */
export function hashesMatch(presented: string, stored: string): boolean {
  const wellFormed = /^[0-9a-f]{64}$/.test(presented) && /^[0-9a-f]{64}$/.test(stored);
  const a = Buffer.from(wellFormed ? presented : NO_MATCH_HASH, 'hex');
  const b = Buffer.from(wellFormed ? stored : NO_MATCH_HASH, 'hex');
  return timingSafeEqual(a, b) && wellFormed;
}
