import { GROUP_ROLES, PERMISSIONS, principalsOf, type GroupRole, type SiteRole } from '@/lib/access';

// Who may do what in a group: read from the one permission table in lib/access (its group-level rows).

export type GroupActor = { id: string; name: string; siteRole: SiteRole };
export type GroupAction = 'manage_members' | 'invite_members' | 'view_access_log';

/** True when the actor (with its role in the group, if any) may take a group-level action. */
export function mayInGroup(actor: Pick<GroupActor, 'id' | 'siteRole'>, groupRole: GroupRole | undefined, action: GroupAction): boolean {
  const principals = principalsOf({ kind: 'user', userId: actor.id, siteRole: actor.siteRole, groupRole });
  // Group-level actions are the same in every phase of the table (GROUP_ADMIN in lib/access/permissions.ts).
  return PERMISSIONS.published[action].some((p) => principals.includes(p));
}

/**
 * Roles the actor may put on an invitation: owners and site admins any role; curators (invite_members only)
 * members and curators, never owners, so nobody grants more than they hold.
 */
export function invitableRoles(actor: Pick<GroupActor, 'id' | 'siteRole'>, groupRole: GroupRole | undefined): GroupRole[] {
  if (mayInGroup(actor, groupRole, 'manage_members')) return [...GROUP_ROLES];
  if (mayInGroup(actor, groupRole, 'invite_members')) return ['curator', 'member'];
  return [];
}

/** Words for a role in sentences ("as a curator"). */
export const ROLE_WORDS: Readonly<Record<GroupRole, string>> = {
  owner: 'an owner',
  curator: 'a curator',
  member: 'a member',
};

/** What each role may do, in one line, for invitations and the members page. */
export const ROLE_DUTIES: Readonly<Record<GroupRole, string>> = {
  owner: 'manages members and roles, and publishes and curates the group’s datasets',
  curator: 'reviews and publishes the group’s datasets and invites new members',
  member: 'deposits datasets for the group and sends reviewer links',
};
