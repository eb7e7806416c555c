import 'server-only';
import { env } from '@/lib/env';
import { DOUBLE_CLICK_WINDOW_MS, isDoubleClick } from './double-click';
import { isRobotUserAgent } from './is-robot';
import { insertUsageEvent, lastCountedUse, type UsageKind } from './repo';
import type { Viewer } from './request-source';
import { sessionHashesNear, type SessionSource } from './session-hash';

export type { UsageKind };

export type UsageInput = {
  versionId: string;
  /** investigation = the landing page or its curves were looked at; request = a file or the package was downloaded. */
  kind: UsageKind;
  /** The file downloaded; null for the landing page and for the whole package. */
  fileId?: string | null;
  viewer: Viewer;
  /** Set when the use came through a reviewer link; in anonymous mode the link, not the client, makes the session. */
  reviewerLink?: { id: string; anonymous: boolean } | null;
  now?: Date;
};

export type UsageOutcome = { eventId: number; counted: boolean; robot: boolean };

/** The session's identity: the signed-in user, else the client (IP + user agent), else, for anonymous links, the link. */
function sourceOf(input: UsageInput): SessionSource {
  if (input.reviewerLink?.anonymous) return { kind: 'link', linkId: input.reviewerLink.id };
  if (input.viewer.userId && !input.reviewerLink) return { kind: 'user', userId: input.viewer.userId };
  return { kind: 'client', ip: input.viewer.ip, userAgent: input.viewer.userAgent };
}

/**
 * Logs one view or download (COUNTER Code of Practice for Research Data). Every use is kept; `counted` is false
 * for a double-click within 30 s of the session's last counted use of the same item, `is_robot` for robots.
 * Reviewer-link uses never store a user id; anonymous ones keep no trace of IP or user agent, not even in the hash.
 */
export async function recordUsage(input: UsageInput): Promise<UsageOutcome> {
  const at = input.now ?? new Date();
  const fileId = input.fileId ?? null;
  const robot = isRobotUserAgent(input.viewer.userAgent);
  const hashes = sessionHashesNear(env().NEXTAUTH_SECRET, sourceOf(input), at, DOUBLE_CLICK_WINDOW_MS);
  const last = await lastCountedUse({
    sessionHashes: hashes, versionId: input.versionId, kind: input.kind, fileId, since: new Date(at.getTime() - DOUBLE_CLICK_WINDOW_MS), until: at,
  });
  const counted = !isDoubleClick(last, at);
  const eventId = await insertUsageEvent({
    versionId: input.versionId, fileId, kind: input.kind, userId: input.reviewerLink ? null : input.viewer.userId,
    reviewerLinkId: input.reviewerLink?.id ?? null, sessionHash: hashes[0], isRobot: robot, counted, at,
  });
  return { eventId, counted, robot };
}
