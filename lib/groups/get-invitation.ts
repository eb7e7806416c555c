import 'server-only';
import type { GroupRole } from '@/lib/access';
import { findUserById } from '@/lib/users/repo';
import type { GroupActor } from './group-access';
import { invitationStatus, type InvitationStatus } from './invitation-status';
import { hashInvitationToken, isWellFormedInvitationToken } from './invitation-token';
import { groupRoleOf } from './repo';
import { findInvitationByTokenHash } from './repo-invitations';

export type InvitationPage =
  | { status: 'not_found' }
  | {
      status: InvitationStatus;
      groupSlug: string; groupName: string; role: GroupRole; email: string; invitedBy: string | null; expiresAt: string;
      /** Who is looking: not signed in, signed in with the invited address, or with another one. */
      viewer: { kind: 'anonymous' } | { kind: 'invitee'; memberAs: GroupRole | null } | { kind: 'other'; email: string };
    };

/** What the invitation page shows for a token; nothing about the group unless the token is real. */
export async function getInvitation(args: { user: GroupActor | null; token: unknown }, now: Date = new Date()): Promise<InvitationPage> {
  if (!isWellFormedInvitationToken(args.token)) return { status: 'not_found' };
  const inv = await findInvitationByTokenHash(hashInvitationToken(args.token));
  if (!inv) return { status: 'not_found' };
  const account = args.user ? await findUserById(args.user.id) : undefined;
  let viewer: Extract<InvitationPage, { groupSlug: string }>['viewer'] = { kind: 'anonymous' };
  if (account && account.email.toLowerCase() === inv.email.toLowerCase()) viewer = { kind: 'invitee', memberAs: (await groupRoleOf(account.id, inv.group_id)) ?? null };
  else if (account) viewer = { kind: 'other', email: account.email };
  return {
    status: invitationStatus(inv, now), groupSlug: inv.group_slug, groupName: inv.group_name, role: inv.role, email: inv.email,
    invitedBy: inv.inviter_name, expiresAt: new Date(inv.expires_at).toISOString(), viewer,
  };
}
