import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { recordUsage, type UsageOutcome } from '@/lib/counter/record-usage';
import type { Viewer } from '@/lib/counter/request-source';
import type { ResolvedLink } from './resolve-reviewer-link';
import { touchLinkLastUsed } from './repo';

export type LinkUse = {
  link: ResolvedLink;
  event: 'view' | 'download';
  /** The file downloaded; null for the page and for the whole package. */
  fileId?: string | null;
  /** Only the user agent is read (robot filter); nothing about the client is stored for a link use. */
  viewer: Pick<Viewer, 'ip' | 'userAgent'>;
  now?: Date;
};

/**
 * Logs one use of a reviewer link: the COUNTER event, last_used_at and an audit entry. Time and kind of use only:
 * never a user id or IP hash; in anonymous mode not even the client's session hash (the link stands for it).
 */
export async function recordLinkUse(use: LinkUse): Promise<UsageOutcome> {
  const at = use.now ?? new Date();
  const { grant, linkId } = use.link;
  const viewer = grant.anonymous ? { userId: null, ip: null, userAgent: use.viewer.userAgent } : { userId: null, ...use.viewer };
  const outcome = await recordUsage({
    versionId: grant.versionId, kind: use.event === 'download' ? 'request' : 'investigation', fileId: use.fileId ?? null,
    viewer, reviewerLink: { id: linkId, anonymous: grant.anonymous }, now: at,
  });
  await touchLinkLastUsed(linkId, at);
  await recordAudit({
    action: 'reviewer_link.use', actorKind: 'reviewer', groupId: use.link.groupId, targetType: 'reviewer_link', targetId: linkId,
    details: { versionId: grant.versionId, event: use.event, fileId: use.fileId ?? null },
  });
  return outcome;
}
