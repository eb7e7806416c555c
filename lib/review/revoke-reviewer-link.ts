import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { hiddenAs } from '@/lib/datasets/hidden-as';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';
import type { LinkActor } from './create-reviewer-link';
import { summariseLink, type LinkSummary } from './link-summary';
import { findLinkById, markLinkRevoked } from './repo';

export const LINK_NOT_FOUND = 'We could not find this review link, or you do not have access to it.';

/** Loads a link and checks the caller may manage the links of its version (404 for unknown ids). */
export async function requireManagedLink(linkId: string, user: LinkActor | null) {
  const link = await findLinkById(linkId);
  if (!link) throw new AppError('not_found', LINK_NOT_FOUND);
  const ctx = await requireVersionAction(link.version_id, user, 'manage_links').catch(hiddenAs(LINK_NOT_FOUND));
  return { link, ctx, user: user as LinkActor };
}

/** Stops a link at once, for good. Revoking a revoked link changes nothing and answers the same. */
export async function revokeReviewerLink(args: { user: LinkActor | null; linkId: string }, now: Date = new Date()): Promise<LinkSummary> {
  const { link, ctx, user } = await requireManagedLink(args.linkId, args.user);
  if (link.revoked_at === null) {
    await markLinkRevoked(link.id, now);
    await recordAudit({
      action: 'reviewer_link.revoke', actorKind: 'user', actorUserId: user.id, groupId: ctx.version.group_id,
      targetType: 'reviewer_link', targetId: link.id, details: { versionId: link.version_id, label: link.label },
    });
  }
  const after = await findLinkById(link.id);
  return summariseLink(after ?? link, now);
}
