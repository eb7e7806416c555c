import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

// Personal access tokens: "ohm_" + 32 random bytes in base64url (43 characters). Only the SHA-256 is stored: the
// secret has 256 bits of entropy, so a fast hash is enough (no password-style stretching needed).
export const TOKEN_PREFIX = 'ohm_';
const TOKEN_PATTERN = /^ohm_[A-Za-z0-9_-]{43}$/;
/** Characters shown in lists so that people can tell tokens apart: "ohm_" and the first 8 of the secret. */
export const DISPLAY_PREFIX_LENGTH = 12;

export type NewTokenSecret = { token: string; tokenHash: string; displayPrefix: string };

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** True when the text has the shape of one of our tokens (checked before any database look-up). */
export function looksLikeToken(text: string): boolean {
  return TOKEN_PATTERN.test(text);
}

export function generateTokenSecret(random: (n: number) => Buffer = randomBytes): NewTokenSecret {
  const token = `${TOKEN_PREFIX}${random(32).toString('base64url')}`;
  return { token, tokenHash: hashToken(token), displayPrefix: token.slice(0, DISPLAY_PREFIX_LENGTH) };
}

/** Compares two hex digests in constant time (lengths differ → false without comparing contents). */
export function hashesEqual(a: string, b: string): boolean {
  const x = Buffer.from(a, 'utf8');
  const y = Buffer.from(b, 'utf8');
  return x.length === y.length && timingSafeEqual(x, y);
}
