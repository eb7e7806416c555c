import 'server-only';
import { AppError } from '@/lib/errors';
import { closedInvitationError } from './accept-invitation';
import { INVALID_INVITATION } from './invitation-status';
import type { GroupActor } from './group-access';
import { hashInvitationToken, isWellFormedInvitationToken } from './invitation-token';
import { answerInvitation } from './repo-invitations';

export type DeclineResult = { groupSlug: string; groupName: string };

/** Declines an open invitation. The link alone is enough (it reached the invited mailbox); no account is needed. */
export async function declineInvitation(args: { user: GroupActor | null; token: unknown }, now: Date = new Date()): Promise<DeclineResult> {
  if (!isWellFormedInvitationToken(args.token)) throw new AppError('not_found', INVALID_INVITATION, { reason: 'not_found' });
  return answerInvitation(hashInvitationToken(args.token), (inv, group) => {
    const closed = closedInvitationError(inv, now);
    if (closed) throw closed;
    return {
      mark: 'declined',
      changes: [],
      audit: {
        action: 'group.invitation_declined', actorKind: args.user ? 'user' : 'anonymous', actorUserId: args.user?.id ?? null, groupId: group.id,
        targetType: 'group_invitation', targetId: inv.id, details: { email: inv.email, role: inv.role },
      },
      result: { groupSlug: group.slug, groupName: group.name },
    };
  });
}
