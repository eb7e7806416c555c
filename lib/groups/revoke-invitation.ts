import 'server-only';
import { AppError } from '@/lib/errors';
import { invitableRoles, type GroupActor } from './group-access';
import { roleIn } from './member-rules';
import { deleteOpenInvitation } from './repo-invitations';
import { requireGroup, requireSignedIn } from './require-group';

/**
 * Withdraws an unanswered invitation: its link stops working at once and unsent mail is dropped. Whoever could
 * have sent it may withdraw it (curators cannot withdraw an owner invitation).
 */
export async function revokeInvitation(args: { user: GroupActor | null; slug: string; invitationId: string }): Promise<{ revoked: true }> {
  const user = requireSignedIn(args.user, 'withdraw invitations');
  const group = await requireGroup(args.slug);
  const done = await deleteOpenInvitation(
    group.id,
    args.invitationId,
    (row) => ({
      action: 'group.invitation_revoked', actorKind: 'user', actorUserId: user.id, groupId: group.id, targetType: 'group_invitation', targetId: row.id,
      details: { email: row.email, role: row.role },
    }),
    (locked, row) => {
      const roles = invitableRoles(user, roleIn(locked, user.id));
      if (roles.length === 0) throw new AppError('forbidden', `Only curators and owners of ${locked.name} can withdraw invitations.`);
      if (row && !roles.includes(row.role)) throw new AppError('forbidden', 'Only owners can withdraw an invitation to become owner.');
    },
  );
  if (!done) throw new AppError('not_found', 'There is no open invitation with this id in the group; it may have been answered or withdrawn already.');
  return { revoked: true };
}
