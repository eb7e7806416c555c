import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';

// A queued reviewer mail holds a live link and an address; in the outbox it is kept sealed (AES-256-GCM) so a
// database reader sees neither. Key: HKDF-SHA-256 of the server secret (RFC 5869); 96-bit IV (NIST SP 800-38D).

const INFO = 'ohmstead/review-mail/v1';

function keyOf(secret: string): Buffer {
  return Buffer.from(hkdfSync('sha256', secret, 'ohmstead', INFO, 32));
}

/** base64url of IV (12 bytes) ‖ tag (16 bytes) ‖ ciphertext of the JSON value. */
export function sealPayload(secret: string, value: unknown): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyOf(secret), iv);
  const body = Buffer.concat([cipher.update(JSON.stringify(value), 'utf8'), cipher.final()]);
  return Buffer.concat([iv, cipher.getAuthTag(), body]).toString('base64url');
}

/** The sealed value; throws when the text was altered or sealed with another secret. */
export function unsealPayload(secret: string, sealed: string): unknown {
  const raw = Buffer.from(sealed, 'base64url');
  if (raw.length < 29) throw new Error('sealed payload is too short');
  const decipher = createDecipheriv('aes-256-gcm', keyOf(secret), raw.subarray(0, 12));
  decipher.setAuthTag(raw.subarray(12, 28));
  return JSON.parse(Buffer.concat([decipher.update(raw.subarray(28)), decipher.final()]).toString('utf8'));
}
