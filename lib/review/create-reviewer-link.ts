import 'server-only';
import { randomUUID } from 'node:crypto';
import { recordAudit } from '@/lib/audit/record-audit';
import type { SiteRole } from '@/lib/access';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { checkLinkExpiry, checkLinkLabel } from './link-rules';
import { summariseLink, type LinkSummary } from './link-summary';
import { findLinkById, insertReviewerLink } from './repo';
import { generateReviewToken, hashReviewToken } from './token';
import { reviewUrl } from './urls';

export type LinkActor = { id: string; siteRole: SiteRole };
export type CreateLinkInput = { label: unknown; expiresAt?: unknown; anonymous?: unknown };
/** `token` and `url` exist only in this answer: the database keeps the token's hash. */
export type CreatedLink = { link: LinkSummary; token: string; url: string };

/** A new reviewer link for a version, by its group ('manage_links'); the token is returned once. */
export async function createReviewerLink(
  args: { user: LinkActor | null; versionId: string; input: CreateLinkInput },
  now: Date = new Date(),
): Promise<CreatedLink> {
  const ctx = await requireVersionAction(args.versionId, args.user, 'manage_links');
  const label = checkLinkLabel(args.input.label);
  const expiresAt = checkLinkExpiry(args.input.expiresAt, now);
  const anonymous = args.input.anonymous === true;
  const user = args.user as LinkActor; // manage_links is never granted to anonymous visitors

  const id = randomUUID();
  const token = generateReviewToken();
  await insertReviewerLink({ id, versionId: ctx.version.id, label, tokenHash: hashReviewToken(token), anonymous, expiresAt, createdBy: user.id, createdAt: now });
  await recordAudit({
    action: 'reviewer_link.create', actorKind: 'user', actorUserId: user.id, groupId: ctx.version.group_id,
    targetType: 'reviewer_link', targetId: id, details: { versionId: ctx.version.id, label, anonymous, expiresAt: expiresAt.toISOString() },
  });
  const row = await findLinkById(id);
  if (!row) throw new Error(`reviewer link ${id} vanished right after it was written`);
  return { link: summariseLink(row, now), token, url: reviewUrl(token) };
}
