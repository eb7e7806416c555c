import 'server-only';
import { randomUUID } from 'node:crypto';
import schema from '@/schemas/api/create-invitation.schema.json';
import type { GroupRole } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { defaultOutboxHandlers, tryOutboxJobNow, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { isLimited, recordHit, type RateLimit } from '@/lib/rate-limit/rate-limit';
import { invitableRoles, type GroupActor } from './group-access';
import { invitationMail } from './invitation-mail';
import { generateInvitationToken, hashInvitationToken, INVITATION_TTL_DAYS } from './invitation-token';
import { asObject, fieldError, parseWith, tidy } from './parse-input';
import { insertInvitation, scrubDeliveredInvitationMail } from './repo-invitations';
import { requireGroup, requireSignedIn } from './require-group';
import { invitationUrl } from './urls';

export type InviteBody = { email: string; role: GroupRole };
export type InvitationSummary = { id: string; email: string; role: GroupRole; expiresAt: string; status: 'pending' };
export type InviteResult = { invitation: InvitationSummary; delivery: 'sent' | 'queued'; replaced: number };

/** Invitations are for people one knows: 50 a group per hour stops the hub being used to send bulk mail. */
export const INVITES_PER_GROUP: RateLimit = { name: 'group-invite', max: 50, windowMs: 60 * 60_000 };
/** Workers leave the fresh mail job alone this long while the request tries it itself. */
const FIRST_TRY_HOLD_MS = 60_000;
const DAY_MS = 86_400_000;

export function parseInviteBody(body: unknown): InviteBody {
  const input = tidy(asObject(body, 'Send a JSON object with "email" and "role".'), []);
  const parsed = parseWith<InviteBody>(schema, input, {
    email: 'Give the e-mail address of the person to invite, e.g. name@lab.example.',
    role: 'Choose member, curator or owner.',
  });
  return { ...parsed, email: parsed.email.toLowerCase() };
}

/**
 * Invites an address to the group: a 14-day link (token mailed, only its hash kept), mail through the outbox so a
 * down SMTP relay only delays it, audit entry. A second invitation to the same address replaces the open one.
 */
export async function inviteMember(
  args: { user: GroupActor | null; slug: string; input: unknown },
  deps: { handlers?: OutboxHandlers; now?: Date } = {},
): Promise<InviteResult> {
  const user = requireSignedIn(args.user, 'invite people');
  const body = parseInviteBody(args.input);
  const group = await requireGroup(args.slug);
  if (await isLimited(INVITES_PER_GROUP, group.id)) {
    throw new AppError('rate_limited', `${group.name} sent 50 invitations in the last hour; wait a while before sending more.`);
  }
  const now = deps.now ?? new Date();
  const token = generateInvitationToken();
  // DATETIME keeps whole seconds; the expiry shown in the mail is the one stored.
  const expiresAt = new Date(Math.floor((now.getTime() + INVITATION_TTL_DAYS * DAY_MS) / 1000) * 1000);
  const id = randomUUID();
  const content = invitationMail({
    groupName: group.name, institution: group.institution, inviterName: user.name, email: body.email, role: body.role, url: invitationUrl(token), expiresAt,
  });
  const jobs = mailJobs([{ email: body.email, name: body.email }], content, { aggregateId: id, kind: 'group.invitation', holdMs: FIRST_TRY_HOLD_MS });

  const { jobIds, replaced } = await insertInvitation(
    { id, groupId: group.id, email: body.email, role: body.role, invitedBy: user.id, tokenHash: hashInvitationToken(token), expiresAt },
    jobs,
    { action: 'group.invitation_created', actorKind: 'user', actorUserId: user.id, groupId: group.id, targetType: 'group_invitation', targetId: id, details: { email: body.email, role: body.role } },
    (locked) => {
      const mine = locked.members.find((m) => m.userId === user.id)?.role;
      const roles = invitableRoles(user, mine);
      if (roles.length === 0) throw new AppError('forbidden', `Only curators and owners of ${locked.name} can invite people.`);
      if (!roles.includes(body.role)) throw fieldError('role', 'Curators invite members and curators; only owners can invite an owner.');
      const already = locked.members.find((m) => m.email.toLowerCase() === body.email);
      if (already) throw fieldError('email', `${already.name} (${body.email}) is already ${already.role === 'owner' ? 'an' : 'a'} ${already.role} of ${locked.name}.`, 'conflict');
    },
  );
  await recordHit(INVITES_PER_GROUP, group.id);

  let delivered = false;
  try {
    delivered = (await tryOutboxJobNow(jobIds[0], deps.handlers ?? defaultOutboxHandlers())) === 'done';
    if (delivered) await scrubDeliveredInvitationMail(id);
  } catch (error) {
    log('warn', 'first try of an invitation mail failed; the worker retries it', { invitationId: id, error: error instanceof Error ? error.message : String(error) });
  }
  return { invitation: { id, email: body.email, role: body.role, expiresAt: expiresAt.toISOString(), status: 'pending' }, delivery: delivered ? 'sent' : 'queued', replaced };
}
