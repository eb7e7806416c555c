import { createHash, randomBytes } from 'node:crypto';

// Invitation tokens: 256 random bits, mailed once; the database keeps only their SHA-256.

/** 32 bytes = 256 bits (OWASP Session Management Cheat Sheet: at least 64 bits of entropy). */
export const INVITATION_TOKEN_BYTES = 32;
/** base64url of 32 bytes, unpadded: 43 characters. */
export const INVITATION_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;
/** How long an invitation stays open. */
export const INVITATION_TTL_DAYS = 14;

export function generateInvitationToken(): string {
  return randomBytes(INVITATION_TOKEN_BYTES).toString('base64url');
}

/** SHA-256 of the token's UTF-8 bytes, lower-case hex (64 characters), as group_invitations.token_hash stores it. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function isWellFormedInvitationToken(token: unknown): token is string {
  return typeof token === 'string' && INVITATION_TOKEN_PATTERN.test(token);
}
