// Who may do what in a group, read from lib/access's table: manage_members = owners and site admins,
// invite_members and view_access_log = curators, owners and site admins (lib/access/permissions.ts, GROUP_ADMIN).
import { describe, expect, it } from 'vitest';
import { invitableRoles, mayInGroup } from '@/lib/groups/group-access';
import { invitationMail } from '@/lib/groups/invitation-mail';
import { invitationStatus } from '@/lib/groups/invitation-status';
import { renderMail } from '@/lib/notify/render-mail';

const user = { id: 'u1', siteRole: 'user' as const };
const admin = { id: 'a1', siteRole: 'admin' as const };

describe('mayInGroup and invitableRoles', () => {
  it.each([
    ['owner', true, true, true, ['owner', 'curator', 'member']],
    ['curator', false, true, true, ['curator', 'member']],
    ['member', false, false, false, []],
    [undefined, false, false, false, []],
  ] as const)('%s: manage %s, invite %s, audit %s, roles %j', (role, manage, invite, audit, roles) => {
    expect(mayInGroup(user, role, 'manage_members')).toBe(manage);
    expect(mayInGroup(user, role, 'invite_members')).toBe(invite);
    expect(mayInGroup(user, role, 'view_access_log')).toBe(audit);
    expect(invitableRoles(user, role)).toEqual(roles);
  });

  it('a site admin outside the group may do all three and invite any role', () => {
    expect(['manage_members', 'invite_members', 'view_access_log'].map((a) => mayInGroup(admin, undefined, a as 'manage_members'))).toEqual([true, true, true]);
    expect(invitableRoles(admin, undefined)).toEqual(['owner', 'curator', 'member']);
  });
});

describe('invitationStatus', () => {
  const base = { accepted_at: null, declined_at: null, expires_at: new Date('2027-01-15T12:00:00Z') };
  it('is open while now is before the expiry, expired from the expiry on; answers win', () => {
    expect(invitationStatus(base, new Date('2027-01-15T11:59:59Z'))).toBe('pending');
    expect(invitationStatus(base, new Date('2027-01-15T12:00:00Z'))).toBe('expired');
    expect(invitationStatus({ ...base, accepted_at: new Date() }, new Date('2030-01-01'))).toBe('accepted');
    expect(invitationStatus({ ...base, declined_at: new Date() }, new Date('2020-01-01'))).toBe('declined');
  });
});

describe('invitationMail', () => {
  it('names inviter, group, role, address and expiry in both parts, with the link', () => {
    const mail = renderMail(invitationMail({
      groupName: 'Larkspur Cryogenic Lab', institution: 'Northfell Institute of Technology (invented)', inviterName: 'Maren Quillfeather',
      email: 'new.person@lab.example', role: 'curator', url: 'https://hub.example/invitations/abc', expiresAt: new Date('2027-01-15T12:34:56Z'),
    }));
    expect(mail.subject).toBe('Invitation to join Larkspur Cryogenic Lab on Ohmstead');
    expect(mail.text).toContain('Maren Quillfeather invites you to join Larkspur Cryogenic Lab (Northfell Institute of Technology (invented)) on Ohmstead as a curator.');
    expect(mail.text).toContain('Valid until: 2027-01-15 12:34 UTC');
    expect(mail.text).toContain('Accept or decline the invitation: https://hub.example/invitations/abc');
    expect(mail.html).toContain('<a href="https://hub.example/invitations/abc"');
    expect(mail.html).toContain('new.person@lab.example');
  });
});
