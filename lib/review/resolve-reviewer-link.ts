import 'server-only';
import type { ReviewerLinkGrant } from '@/lib/access';
import { findLinkByTokenHash, type ReviewerLinkRow } from './repo';
import { hashesMatch, hashReviewToken, NO_MATCH_HASH } from './token';

/** groupId is for the audit log only; it is never shown to an anonymous reviewer. */
export type ResolvedLink = { ok: true; grant: ReviewerLinkGrant; linkId: string; groupId: string };
export type LinkProblem = { ok: false; reason: 'not_found' | 'expired' | 'revoked' };
export type LinkResolution = ResolvedLink | LinkProblem;

/** The words each problem shows to the person holding the link. */
export const LINK_PROBLEM_MESSAGES: Readonly<Record<LinkProblem['reason'], string>> = {
  not_found: 'This review link is not valid. Check that you copied the whole address, or ask the authors for a new link.',
  expired: 'This review link has expired. Ask the authors for a new link.',
  revoked: 'This review link has been revoked. Ask the authors for a new link.',
};

/** The lib/access grant a stored link gives; decide() checks version, expiry and revocation again. */
export function grantOf(row: Pick<ReviewerLinkRow, 'version_id' | 'expires_at' | 'revoked_at' | 'anonymous'>): ReviewerLinkGrant {
  return { versionId: row.version_id, expiresAt: row.expires_at, revokedAt: row.revoked_at, anonymous: row.anonymous };
}

/**
 * Token → link. Every input costs one SHA-256, one indexed query and one constant-time compare, so tampered,
 * truncated and guessed tokens all take the same path to not_found. Revoked wins over expired (as in lib/access).
 */
export async function resolveReviewerLink(token: string, now: Date = new Date()): Promise<LinkResolution> {
  const presented = hashReviewToken(typeof token === 'string' ? token : '');
  const row = await findLinkByTokenHash(presented);
  const matched = hashesMatch(presented, row?.token_hash ?? NO_MATCH_HASH);
  if (!row || !matched) return { ok: false, reason: 'not_found' };
  if (row.revoked_at !== null) return { ok: false, reason: 'revoked' };
  if (now.getTime() >= row.expires_at.getTime()) return { ok: false, reason: 'expired' };
  return { ok: true, grant: grantOf(row), linkId: row.id, groupId: row.group_id };
}
