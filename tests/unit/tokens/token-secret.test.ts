import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { generateTokenSecret, hashesEqual, hashToken, looksLikeToken } from '@/lib/tokens/token-secret';

describe('token secrets', () => {
  it('are "ohm_" + 32 random bytes in base64url, with a 12-character display prefix', () => {
    // 32 bytes of 0xff → base64url "__________________________________________8" (43 characters, RFC 4648 §5, no padding).
    const fixed = generateTokenSecret((n) => Buffer.alloc(n, 0xff));
    expect(fixed.token).toBe(`ohm_${'_'.repeat(42)}8`);
    expect(fixed.token).toHaveLength(47);
    expect(fixed.displayPrefix).toBe('ohm_________');
    const random = generateTokenSecret();
    expect(random.token).toMatch(/^ohm_[A-Za-z0-9_-]{43}$/);
    expect(random.displayPrefix).toBe(random.token.slice(0, 12));
    expect(generateTokenSecret().token).not.toBe(random.token);
  });

  it('store the SHA-256 hex of the whole token, never the token', () => {
    // SHA-256("abc") from FIPS 180-2, appendix B.1.
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    const s = generateTokenSecret();
    expect(s.tokenHash).toBe(createHash('sha256').update(s.token).digest('hex'));
    expect(s.tokenHash).toHaveLength(64);
    expect(s.tokenHash).not.toContain(s.token.slice(4, 20));
  });

  it('are recognised by shape before any database look-up', () => {
    expect(looksLikeToken(generateTokenSecret().token)).toBe(true);
    expect(looksLikeToken('ohm_short')).toBe(false);
    expect(looksLikeToken(`ghp_${'a'.repeat(43)}`)).toBe(false);
    expect(looksLikeToken(`ohm_${'a'.repeat(42)}=`)).toBe(false);
    expect(looksLikeToken(`ohm_${'a'.repeat(43)} `)).toBe(false);
    expect(looksLikeToken(`ohm_${"a'--".repeat(11)}`)).toBe(false);
  });
});

describe('constant-time digest comparison', () => {
  it('is true only for identical digests', () => {
    const a = hashToken('first');
    expect(hashesEqual(a, hashToken('first'))).toBe(true);
    expect(hashesEqual(a, hashToken('second'))).toBe(false);
    // Differs only in the last character.
    expect(hashesEqual(a, a.slice(0, 63) + (a.endsWith('0') ? '1' : '0'))).toBe(false);
  });

  it('refuses different lengths without throwing (timingSafeEqual alone would throw)', () => {
    const a = hashToken('first');
    expect(hashesEqual(a, a.slice(0, 32))).toBe(false);
    expect(hashesEqual(a, '')).toBe(false);
  });
});
