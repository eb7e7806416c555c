import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import { renderMail } from '@/lib/notify/render-mail';
import { defaultOutboxHandlers, tryOutboxJobNow, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { isLimited, recordHit, type RateLimit } from '@/lib/rate-limit/rate-limit';
import type { LinkActor } from './create-reviewer-link';
import { checkNote, checkRecipient, linkStatus } from './link-rules';
import { REVIEW_MAIL_TOPIC, reviewOutboxHandlers } from './outbox-handlers';
import { enqueueReviewMail } from './repo';
import { reviewerLinkMail } from './reviewer-mail';
import { requireManagedLink } from './revoke-reviewer-link';
import { sealPayload } from './sealed-payload';
import { hashesMatch, hashReviewToken } from './token';
import { reviewUrl } from './urls';

/** A link is mailed to a few referees, not broadcast: 20 messages per link per hour. */
export const REVIEW_MAIL_PER_LINK: RateLimit = { name: 'review-mail-link', max: 20, windowMs: 60 * 60_000 };
/** Workers leave a fresh job alone this long while the request tries it itself. */
const FIRST_TRY_HOLD_MS = 60_000;

export type SendLinkInput = { email: unknown; token: unknown; message?: unknown };
export type SendLinkResult = { linkId: string; delivery: 'sent' | 'queued' };

function fieldError(field: string, message: string): AppError {
  return new AppError('validation_failed', message, { fieldErrors: { [field]: message } });
}

/**
 * E-mails a link to a referee through the outbox. The server keeps only the token's hash, so the caller sends the
 * token it was shown at creation; the address is never stored (sealed in the job, wiped once delivered).
 */
export async function sendReviewerLink(
  args: { user: (LinkActor & { name?: string | null }) | null; linkId: string; input: SendLinkInput },
  deps: { handlers?: OutboxHandlers; now?: Date } = {},
): Promise<SendLinkResult> {
  const now = deps.now ?? new Date();
  const { link, ctx, user } = await requireManagedLink(args.linkId, args.user);
  const status = linkStatus({ expiresAt: link.expires_at, revokedAt: link.revoked_at }, now);
  if (status !== 'active') throw new AppError('conflict', `This review link has ${status === 'revoked' ? 'been revoked' : 'expired'}; create a new link to send.`);
  if (!hashesMatch(hashReviewToken(String(args.input.token ?? '')), link.token_hash)) {
    throw fieldError('token', 'This is not the token of this link. Send the link right after creating it, or create a new one.');
  }
  const to = checkRecipient(args.input.email);
  const message = checkNote(args.input.message);
  if (await isLimited(REVIEW_MAIL_PER_LINK, link.id, now.getTime())) {
    throw new AppError('rate_limited', 'This link was e-mailed 20 times in the last hour; wait a while before sending it again.');
  }

  const content = reviewerLinkMail({
    title: ctx.version.title, versionNumber: ctx.version.version_number, url: reviewUrl(String(args.input.token)), expiresAt: link.expires_at, message,
    sender: link.anonymous ? null : { name: args.user?.name?.trim() || 'A member of the group', groupName: ctx.version.group_name },
  });
  const sealed = sealPayload(env().NEXTAUTH_SECRET, { to, ...renderMail(content) });
  const jobId = await enqueueReviewMail(REVIEW_MAIL_TOPIC, link.id, { linkId: link.id, sealed }, FIRST_TRY_HOLD_MS);
  await recordHit(REVIEW_MAIL_PER_LINK, link.id, now.getTime());
  await recordAudit({
    action: 'reviewer_link.send', actorKind: 'user', actorUserId: user.id, groupId: ctx.version.group_id,
    targetType: 'reviewer_link', targetId: link.id, details: { versionId: link.version_id, anonymous: link.anonymous },
  });

  let outcome: 'done' | 'failed' | 'skipped' = 'failed';
  try {
    outcome = await tryOutboxJobNow(jobId, deps.handlers ?? { ...defaultOutboxHandlers(), ...reviewOutboxHandlers() });
  } catch (error) {
    log('warn', 'first try of a reviewer mail failed; the worker retries it', { jobId, error: error instanceof Error ? error.message : String(error) });
  }
  return { linkId: link.id, delivery: outcome === 'done' ? 'sent' : 'queued' };
}
