import type { GroupRole } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { mayInGroup, type GroupActor } from './group-access';
import type { LockedGroup, LockedMember } from './repo-members';
import { LAST_OWNER_MESSAGE } from './repo-members';

// Checks shared by the membership operations; each runs on the group as locked, so what it sees is current.

export function roleIn(group: LockedGroup, userId: string): GroupRole | undefined {
  return group.members.find((m) => m.userId === userId)?.role;
}

/** Owners and site admins only ('manage_members'); curators and members are told who can. */
export function requireManager(user: GroupActor, group: LockedGroup, doing: string): void {
  if (!mayInGroup(user, roleIn(group, user.id), 'manage_members')) {
    throw new AppError('forbidden', `Only owners of ${group.name} (and site admins) can ${doing}.`);
  }
}

export function requireMember(group: LockedGroup, userId: string): LockedMember {
  const member = group.members.find((m) => m.userId === userId);
  if (!member) throw new AppError('not_found', `This person is not a member of ${group.name}.`);
  return member;
}

/** Refuses a change that takes the owner role from the group's only owner (the repo checks again after writing). */
export function keepAnOwner(group: LockedGroup, leavingOwnerIds: string[]): void {
  const remaining = group.members.filter((m) => m.role === 'owner' && !leavingOwnerIds.includes(m.userId));
  if (remaining.length === 0) throw new AppError('conflict', LAST_OWNER_MESSAGE, { reason: 'last_owner' });
}

export type MemberView = { userId: string; name: string; role: GroupRole };

export function memberView(m: LockedMember, role: GroupRole = m.role): MemberView {
  return { userId: m.userId, name: m.name, role };
}
