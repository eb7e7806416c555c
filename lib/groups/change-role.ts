import 'server-only';
import schema from '@/schemas/api/change-member-role.schema.json';
import type { GroupRole } from '@/lib/access';
import type { GroupActor } from './group-access';
import { keepAnOwner, memberView, requireManager, requireMember, type MemberView } from './member-rules';
import { asObject, parseWith } from './parse-input';
import { runMembershipPlan } from './repo-members';
import { requireGroup, requireSignedIn } from './require-group';

export type ChangeRoleResult = { member: MemberView; from: GroupRole; changed: boolean };

export function parseRoleBody(body: unknown): { role: GroupRole } {
  return parseWith<{ role: GroupRole }>(schema, asObject(body, 'Send a JSON object with "role".'), { role: 'Choose member, curator or owner.' });
}

/**
 * Owners (and site admins) change a member's role, their own included. Curators cannot, so they cannot demote
 * owners. Taking the owner role from the last owner is refused (409), also when two owners demote at once.
 */
export async function changeMemberRole(args: { user: GroupActor | null; slug: string; userId: string; input: unknown }): Promise<ChangeRoleResult> {
  const user = requireSignedIn(args.user, 'change roles');
  const { role } = parseRoleBody(args.input);
  const group = await requireGroup(args.slug);
  return runMembershipPlan<ChangeRoleResult>(group.id, (locked) => {
    requireManager(user, locked, 'change roles');
    const target = requireMember(locked, args.userId);
    if (target.role === role) return { changes: [], audit: [], result: { member: memberView(target), from: target.role, changed: false } };
    if (target.role === 'owner') keepAnOwner(locked, [target.userId]);
    return {
      changes: [{ kind: 'set_role', userId: target.userId, role }],
      audit: [{
        action: 'group.member_role_changed', actorKind: 'user', actorUserId: user.id, groupId: locked.id, targetType: 'user', targetId: target.userId,
        details: { from: target.role, to: role, name: target.name },
      }],
      result: { member: memberView(target, role), from: target.role, changed: true },
    };
  });
}
