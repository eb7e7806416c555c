import 'server-only';
import type { GroupRole } from '@/lib/access';
import { invitableRoles, mayInGroup, type GroupActor } from './group-access';
import { groupStorage, type GroupStorage } from './group-storage';
import { invitationStatus, type InvitationStatus } from './invitation-status';
import { listMembersWithJoined } from './repo-members';
import { listOpenInvitations } from './repo-invitations';
import { requireGroup } from './require-group';

export type MemberListItem = {
  userId: string; name: string; role: GroupRole; orcid: string | null;
  /** Only for the group's own members and site admins. */
  email?: string; joinedAt?: string;
};
export type OpenInvitation = { id: string; email: string; role: GroupRole; status: Extract<InvitationStatus, 'pending' | 'expired'>; expiresAt: string; invitedBy: string | null; createdAt: string };

export type MembersView = {
  group: { id: string; slug: string; name: string; institution: string | null; description: string | null };
  /** 'full' for members and site admins; everyone else sees names and roles, as on the public group page. */
  access: 'full' | 'public';
  viewerRole: GroupRole | null;
  can: { manageMembers: boolean; invite: boolean; viewAudit: boolean; transferOwnership: boolean };
  invitableRoles: GroupRole[];
  members: MemberListItem[];
  /** Unanswered invitations, for those who may invite; empty otherwise. */
  invitations: OpenInvitation[];
  storage: GroupStorage | null;
};

/** Everything the members page and GET /api/v1/groups/{slug}/members show, cut to what the viewer may see. */
export async function getMembersView(args: { user: GroupActor | null; slug: string }, now: Date = new Date()): Promise<MembersView> {
  const group = await requireGroup(args.slug);
  const rows = await listMembersWithJoined(group.id);
  const { user } = args;
  const viewerRole = user ? (rows.find((m) => m.userId === user.id)?.role ?? null) : null;
  const full = Boolean(user && (viewerRole || user.siteRole === 'admin'));
  const may = (action: 'manage_members' | 'invite_members' | 'view_access_log') => Boolean(user && mayInGroup(user, viewerRole ?? undefined, action));
  const roles = user ? invitableRoles(user, viewerRole ?? undefined) : [];
  const invitations = roles.length ? await listOpenInvitations(group.id) : [];
  return {
    group: { id: group.id, slug: group.slug, name: group.name, institution: group.institution, description: group.description },
    access: full ? 'full' : 'public',
    viewerRole,
    can: { manageMembers: may('manage_members'), invite: roles.length > 0, viewAudit: may('view_access_log'), transferOwnership: viewerRole === 'owner' },
    invitableRoles: roles,
    members: rows.map((m) => ({
      userId: m.userId, name: m.name, role: m.role, orcid: m.orcid,
      ...(full ? { email: m.email, joinedAt: new Date(m.joinedAt).toISOString() } : {}),
    })),
    invitations: invitations.map((i) => ({
      id: i.id, email: i.email, role: i.role, status: invitationStatus(i, now) === 'pending' ? 'pending' : 'expired',
      expiresAt: new Date(i.expires_at).toISOString(), invitedBy: i.inviter_name, createdAt: new Date(i.created_at).toISOString(),
    })),
    storage: full ? groupStorage(group) : null,
  };
}
