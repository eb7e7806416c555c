import 'server-only';
import { requireVersionAction } from '@/lib/datasets/version-access';
import type { LinkActor } from './create-reviewer-link';
import { summariseLink, type LinkSummary } from './link-summary';
import { listLinksWithUses, listLinkUses } from './repo';

/** The version's reviewer links with their use counts, for its group ('manage_links'). */
export async function listReviewerLinks(args: { user: LinkActor | null; versionId: string }, now: Date = new Date()): Promise<LinkSummary[]> {
  const ctx = await requireVersionAction(args.versionId, args.user, 'manage_links');
  return (await listLinksWithUses(ctx.version.id)).map((row) => summariseLink(row, now));
}

export type LinkAccessEvent = {
  at: string;
  event: 'view' | 'download';
  linkId: string;
  linkLabel: string;
  /** False when COUNTER's 30-second double-click filter or the robot filter left it out of the counts. */
  counted: boolean;
  robot: boolean;
};

export const ACCESS_LOG_LIMIT = 500;

/** When each link was used and for what, newest first, for the group's stewards ('view_access_log'); never by whom. */
export async function getLinkAccessLog(args: { user: LinkActor | null; versionId: string }): Promise<LinkAccessEvent[]> {
  const ctx = await requireVersionAction(args.versionId, args.user, 'view_access_log');
  return (await listLinkUses(ctx.version.id, ACCESS_LOG_LIMIT)).map((u) => ({
    at: u.created_at.toISOString(),
    event: u.kind === 'request' ? 'download' : 'view',
    linkId: u.link_id,
    linkLabel: u.label,
    counted: u.counted && !u.is_robot,
    robot: u.is_robot,
  }));
}
