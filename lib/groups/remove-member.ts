import 'server-only';
import type { GroupRole } from '@/lib/access';
import type { GroupActor } from './group-access';
import { keepAnOwner, requireManager, requireMember } from './member-rules';
import { runMembershipPlan } from './repo-members';
import { requireGroup, requireSignedIn } from './require-group';

export type RemoveResult = { userId: string; role: GroupRole; left: boolean };

/**
 * Owners (and site admins) remove members; anyone may leave on their own. The group's datasets stay with the
 * group. Removing or letting go of the last owner is refused (409).
 */
export async function removeMember(args: { user: GroupActor | null; slug: string; userId: string }): Promise<RemoveResult> {
  const user = requireSignedIn(args.user, 'change the members');
  const group = await requireGroup(args.slug);
  const leaving = args.userId === user.id;
  return runMembershipPlan(group.id, (locked) => {
    if (!leaving) requireManager(user, locked, 'remove members');
    const target = requireMember(locked, args.userId);
    if (target.role === 'owner') keepAnOwner(locked, [target.userId]);
    return {
      changes: [{ kind: 'remove', userId: target.userId }],
      audit: [{
        action: leaving ? 'group.member_left' : 'group.member_removed', actorKind: 'user', actorUserId: user.id, groupId: locked.id,
        targetType: 'user', targetId: target.userId, details: { role: target.role, name: target.name },
      }],
      result: { userId: target.userId, role: target.role, left: leaving },
    };
  });
}
