import 'server-only';
import { env } from '@/lib/env';
import { log } from '@/lib/log';
import { sendQueuedMail, type MailTransportOptions } from '@/lib/notify/send-queued-mail';
import type { OutboxHandlers } from '@/lib/outbox/process-outbox';
import { linkStatus } from './link-rules';
import { findLinkById, scrubReviewMailJob } from './repo';
import { unsealPayload } from './sealed-payload';

/** Reviewer-link mail: its own topic because the payload is sealed and wiped after delivery (see sealed-payload.ts). */
export const REVIEW_MAIL_TOPIC = 'review.mail';

export type ReviewMailPayload = { linkId: string; sealed: string };

function isReviewMailPayload(p: unknown): p is ReviewMailPayload {
  const o = p as Record<string, unknown> | null;
  return !!o && typeof o.linkId === 'string' && typeof o.sealed === 'string';
}

/** Delivers one reviewer mail, unless the link stopped working meanwhile; either way the job keeps no address or link. */
export async function deliverReviewMail(payload: unknown, outboxId: number, mail: MailTransportOptions = {}): Promise<void> {
  const o = payload as Record<string, unknown> | null;
  if (o?.delivered === true) return; // already sent and wiped by an earlier try
  if (!isReviewMailPayload(payload)) throw new Error('review.mail payload needs linkId and sealed');
  const link = await findLinkById(payload.linkId);
  if (link && linkStatus({ expiresAt: link.expires_at, revokedAt: link.revoked_at }, new Date()) === 'active') {
    await sendQueuedMail(unsealPayload(env().NEXTAUTH_SECRET, payload.sealed), mail);
  } else {
    log('info', 'reviewer mail dropped: the link was revoked or expired before delivery', { outboxId, linkId: payload.linkId });
  }
  await scrubReviewMailJob(outboxId, payload.linkId);
}

/** The outbox jobs of reviewer links; to be merged into defaultOutboxHandlers() so workers retry them. */
export function reviewOutboxHandlers(options: { mail?: MailTransportOptions } = {}): OutboxHandlers {
  return { [REVIEW_MAIL_TOPIC]: (payload, row) => deliverReviewMail(payload, row.id, options.mail) };
}
