import 'server-only';
import type { GroupRole } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { findUserById } from '@/lib/users/repo';
import type { GroupActor } from './group-access';
import { INVALID_INVITATION, invitationStatus, utcDay } from './invitation-status';
import { hashInvitationToken, isWellFormedInvitationToken } from './invitation-token';
import { answerInvitation, findInvitationByTokenHash, type InvitationView } from './repo-invitations';

export type AcceptResult = { groupSlug: string; groupName: string; role: GroupRole; alreadyMember: boolean };

/** The refusal for an invitation that can no longer be answered, in the words the invitation page uses too. */
export function closedInvitationError(inv: InvitationView, now: Date): AppError | null {
  const status = invitationStatus(inv, now);
  if (status === 'accepted') return new AppError('conflict', `This invitation to ${inv.group_name} was already accepted.`, { reason: 'accepted' });
  if (status === 'declined') return new AppError('conflict', `This invitation to ${inv.group_name} was declined. Ask the group to invite you again if you changed your mind.`, { reason: 'declined' });
  if (status === 'expired') {
    return new AppError('conflict', `This invitation to ${inv.group_name} expired on ${utcDay(inv.expires_at)}. Ask an owner or curator of the group to invite you again.`, { reason: 'expired' });
  }
  return null;
}

function mismatch(inv: InvitationView, signedInAs: string): AppError {
  return new AppError(
    'forbidden',
    `This invitation was sent to ${inv.email}, but you are signed in as ${signedInAs}. Sign out, then sign in with ${inv.email} to accept it.`,
    { reason: 'wrong_account' },
  );
}

/**
 * Accepts with the signed-in account whose e-mail address is the invited one. The address must be verified; an
 * account that signed up with a password but never confirmed its address is verified here, because the mailed
 * link proves the mailbox just as a sign-in link would.
 */
export async function acceptInvitation(args: { user: GroupActor | null; token: unknown }, now: Date = new Date()): Promise<AcceptResult> {
  if (!isWellFormedInvitationToken(args.token)) throw new AppError('not_found', INVALID_INVITATION, { reason: 'not_found' });
  const tokenHash = hashInvitationToken(args.token);
  const first = await findInvitationByTokenHash(tokenHash);
  if (!first) throw new AppError('not_found', INVALID_INVITATION, { reason: 'not_found' });
  if (!args.user) throw new AppError('not_signed_in', `Sign in with ${first.email} to accept this invitation.`, { reason: 'not_signed_in' });
  const account = await findUserById(args.user.id);
  if (!account || account.disabled_at) throw new AppError('forbidden', 'This account cannot accept invitations.', { reason: 'disabled' });

  return answerInvitation(tokenHash, (inv, group) => {
    const closed = closedInvitationError(inv, now);
    if (closed) throw closed;
    if (account.email.toLowerCase() !== inv.email.toLowerCase()) throw mismatch(inv, account.email);
    const existing = group.members.find((m) => m.userId === account.id);
    const role = existing?.role ?? inv.role;
    return {
      mark: 'accepted',
      changes: existing ? [] : [{ kind: 'add', userId: account.id, role: inv.role }],
      verifyEmailOf: account.email_verified_at ? undefined : account.id,
      audit: {
        action: 'group.invitation_accepted', actorKind: 'user', actorUserId: account.id, groupId: group.id, targetType: 'group_invitation', targetId: inv.id,
        details: { email: inv.email, role: inv.role, ...(existing ? { alreadyMemberAs: existing.role } : {}), emailVerifiedNow: !account.email_verified_at },
      },
      result: { groupSlug: group.slug, groupName: group.name, role, alreadyMember: Boolean(existing) },
    };
  });
}
