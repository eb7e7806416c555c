// Invitations against MariaDB, the outbox and the SMTP fake: mail with both parts, hashed tokens, re-invite,
// accept (right and wrong account), decline, expiry, revoke, and a down SMTP relay that only delays the mail.
// Rules: issue 8 item 3; who may invite: lib/access/permissions.ts ('invite_members': curators, owners, site admin).
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { acceptInvitation } from '@/lib/groups/accept-invitation';
import { declineInvitation } from '@/lib/groups/decline-invitation';
import { getInvitation } from '@/lib/groups/get-invitation';
import { INVALID_INVITATION } from '@/lib/groups/invitation-status';
import { inviteMember } from '@/lib/groups/invite-member';
import { revokeInvitation } from '@/lib/groups/revoke-invitation';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { readMailbox, waitForMail } from '@/tests/support/mailbox';
import {
  auditOf, closeDb, closedPortUrl, drainInvitationMail, labUser, makeGroupLab, rejection, removeGroupLab, rolesOf, tokenFromLinks, uniqueEmail, type GroupLab,
} from './fixtures';

let lab: GroupLab;
const real = publishingOutboxHandlers(); // the app's 'mail.send' handler against the SMTP fake
const DAY = 86_400_000;
const subjectOf = (lab: GroupLab) => `Invitation to join ${lab.name} on Ohmstead`;

beforeAll(async () => {
  lab = await makeGroupLab('invites');
});
afterAll(async () => {
  await removeGroupLab(lab);
  await closeDb();
});

/** Invites `email` as the owner and returns the token from the mail that arrives. */
async function invitedToken(email: string, role: 'member' | 'curator' | 'owner' = 'member'): Promise<{ token: string; id: string }> {
  const since = new Date(Date.now() - 1000);
  const result = await inviteMember({ user: lab.owner, slug: lab.slug, input: { email, role } }, { handlers: real });
  const mail = await waitForMail({ to: email, subject: subjectOf(lab), since });
  return { token: tokenFromLinks(mail.links), id: result.invitation.id };
}

describe('inviteMember', () => {
  it('mails a 14-day link with text and HTML parts; the database keeps only the token hash; audited', async () => {
    const email = uniqueEmail('invitee');
    const since = new Date(Date.now() - 1000);
    const now = new Date();
    const result = await inviteMember({ user: lab.owner, slug: lab.slug, input: { email: `  ${email.toUpperCase()} `, role: 'curator' } }, { handlers: real });
    expect(result).toMatchObject({ delivery: 'sent', replaced: 0, invitation: { email, role: 'curator', status: 'pending' } });
    expect(Math.abs(new Date(result.invitation.expiresAt).getTime() - (now.getTime() + 14 * DAY))).toBeLessThan(1500);

    const mail = await waitForMail({ to: email, subject: subjectOf(lab), since });
    const token = tokenFromLinks(mail.links);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes, base64url
    expect(mail.links).toContain(`${process.env.NEXTAUTH_URL!.replace(/\/+$/, '')}/invitations/${token}`);
    expect(mail.text).toContain(`${lab.owner.name} invites you to join ${lab.name} (Brindlecombe Institute (invented)) on Ohmstead as a curator.`);
    expect(mail.text).toContain(`Invited address: ${email}`);
    expect(mail.html).toContain(`href="${process.env.NEXTAUTH_URL!.replace(/\/+$/, '')}/invitations/${token}"`);
    expect(mail.html).toContain('Accept or decline the invitation');

    const row = await db()('group_invitations').where('id', result.invitation.id).first();
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token);
    // Delivered by the request's own first try, so the job no longer holds the link or the address.
    const jobs = await db()('outbox').where({ aggregate_id: result.invitation.id, topic: 'mail.send' }).select('payload', 'processed_at');
    expect(jobs.length).toBe(1);
    expect(jobs[0].processed_at).not.toBeNull();
    expect(String(jobs[0].payload)).not.toContain(token);
    expect(String(jobs[0].payload)).not.toContain(email);

    const audit = (await auditOf(lab.groupId, 'group.invitation_created')).find((a) => a.target_id === result.invitation.id);
    expect(audit).toMatchObject({ actor_user_id: lab.owner.id, target_type: 'group_invitation', details: { email, role: 'curator', replaced: 0 } });
    expect(JSON.stringify(audit)).not.toContain(token);
  });

  it('the HTML part escapes a group name with markup', async () => {
    const groupName = `Bench <img src=x onerror="alert(1)"> & Co ${lab.slug}`;
    await db()('groups').where('id', lab.groupId).update({ name: groupName });
    try {
      const email = uniqueEmail('escaped');
      const since = new Date(Date.now() - 1000);
      await inviteMember({ user: lab.owner, slug: lab.slug, input: { email, role: 'member' } }, { handlers: real });
      const mail = await waitForMail({ to: email, subject: `Invitation to join ${groupName} on Ohmstead`, since });
      expect(mail.html).toContain('Bench &lt;img src=x onerror=&quot;alert(1)&quot;&gt; &amp; Co');
      expect(mail.html).not.toContain('<img');
    } finally {
      await db()('groups').where('id', lab.groupId).update({ name: lab.name });
    }
  });

  it('curators invite members and curators but not owners; members and outsiders cannot invite', async () => {
    const byCurator = await inviteMember({ user: lab.curator, slug: lab.slug, input: { email: uniqueEmail(), role: 'member' } }, { handlers: real });
    expect(byCurator.invitation.role).toBe('member');
    const owner = await rejection(inviteMember({ user: lab.curator, slug: lab.slug, input: { email: uniqueEmail(), role: 'owner' } }, { handlers: real }));
    expect([owner.status, owner.details?.fieldErrors?.role]).toEqual([422, 'Curators invite members and curators; only owners can invite an owner.']);
    for (const actor of [lab.member, lab.outsider]) {
      const e = await rejection(inviteMember({ user: actor, slug: lab.slug, input: { email: uniqueEmail(), role: 'member' } }, { handlers: real }));
      expect([e.status, e.message]).toEqual([403, `Only curators and owners of ${lab.name} can invite people.`]);
    }
    expect((await rejection(inviteMember({ user: null, slug: lab.slug, input: { email: uniqueEmail(), role: 'member' } }))).status).toBe(401);
    const byAdmin = await inviteMember({ user: lab.admin, slug: lab.slug, input: { email: uniqueEmail(), role: 'owner' } }, { handlers: real });
    expect(byAdmin.invitation.role).toBe('owner');
  });

  it('refuses a bad address (422) and someone who is already a member (409)', async () => {
    const bad = await rejection(inviteMember({ user: lab.owner, slug: lab.slug, input: { email: 'not an address', role: 'member' } }));
    expect([bad.status, bad.details?.fieldErrors?.email]).toEqual([422, 'Give the e-mail address of the person to invite, e.g. name@lab.example.']);
    const member = await rejection(inviteMember({ user: lab.owner, slug: lab.slug, input: { email: lab.member.email, role: 'curator' } }));
    expect([member.status, member.details?.fieldErrors?.email]).toEqual([409, `${lab.member.name} (${lab.member.email}) is already a member of ${lab.name}.`]);
  });

  it('inviting the same address again replaces the open invitation: the old link stops working', async () => {
    const email = uniqueEmail('twice');
    const first = await invitedToken(email, 'member');
    const second = await invitedToken(email, 'curator');
    expect(second.token).not.toBe(first.token);
    const open = await db()('group_invitations').where({ group_id: lab.groupId, email }).select('id', 'role');
    expect(open).toEqual([{ id: second.id, role: 'curator' }]);
    expect(await getInvitation({ user: null, token: first.token })).toEqual({ status: 'not_found' });
    expect((await auditOf(lab.groupId, 'group.invitation_created')).find((a) => a.target_id === second.id)?.details).toMatchObject({ replaced: 1 });
  });
});

describe('accepting', () => {
  it('the invited account accepts and gets the invited role; the answer is audited', async () => {
    const invitee = await labUser(lab, 'Nell Ravenscar');
    const { token, id } = await invitedToken(invitee.email, 'curator');
    expect(await getInvitation({ user: invitee, token })).toMatchObject({ status: 'pending', role: 'curator', groupSlug: lab.slug, invitedBy: lab.owner.name, viewer: { kind: 'invitee', memberAs: null } });
    const result = await acceptInvitation({ user: invitee, token });
    expect(result).toEqual({ groupSlug: lab.slug, groupName: lab.name, role: 'curator', alreadyMember: false });
    expect((await rolesOf(lab.groupId))[invitee.id]).toBe('curator');
    expect((await auditOf(lab.groupId, 'group.invitation_accepted')).find((a) => a.target_id === id)).toMatchObject({
      actor_user_id: invitee.id, details: { email: invitee.email, role: 'curator', emailVerifiedNow: false },
    });
    const again = await rejection(acceptInvitation({ user: invitee, token }));
    expect([again.status, again.details?.reason]).toEqual([409, 'accepted']);
    expect(await getInvitation({ user: invitee, token })).toMatchObject({ status: 'accepted', viewer: { kind: 'invitee', memberAs: 'curator' } });
  });

  it('another account cannot accept (403, with both addresses named); not signed in is 401', async () => {
    const invitee = uniqueEmail('meant-for');
    const { token } = await invitedToken(invitee);
    const wrong = await rejection(acceptInvitation({ user: lab.outsider, token }));
    expect([wrong.status, wrong.details?.reason, wrong.message]).toEqual([
      403, 'wrong_account', `This invitation was sent to ${invitee}, but you are signed in as ${lab.outsider.email}. Sign out, then sign in with ${invitee} to accept it.`,
    ]);
    const anonymous = await rejection(acceptInvitation({ user: null, token }));
    expect([anonymous.status, anonymous.message]).toEqual([401, `Sign in with ${invitee} to accept this invitation.`]);
    expect((await rolesOf(lab.groupId))[lab.outsider.id]).toBeUndefined();
    expect(await getInvitation({ user: lab.outsider, token })).toMatchObject({ status: 'pending', viewer: { kind: 'other', email: lab.outsider.email } });
  });

  it('an account with the address not yet confirmed is confirmed by accepting through the mailed link', async () => {
    const invitee = await labUser(lab, 'Perrin Sollers', { verified: false });
    const { token } = await invitedToken(invitee.email);
    await acceptInvitation({ user: invitee, token });
    const row = await db()('users').where('id', invitee.id).first('email_verified_at');
    expect(row.email_verified_at).toBeInstanceOf(Date);
  });

  it('an expired invitation cannot be accepted or declined (409 expired) and the page says so', async () => {
    const invitee = await labUser(lab, 'Wren Haldane');
    const { token } = await invitedToken(invitee.email);
    const later = new Date(Date.now() + 14 * DAY + 5000);
    const e = await rejection(acceptInvitation({ user: invitee, token }, later));
    expect([e.status, e.details?.reason]).toEqual([409, 'expired']);
    expect(e.message).toMatch(/^This invitation to .+ expired on \d{1,2} [A-Z][a-z]{2} \d{4}\. Ask an owner or curator of the group to invite you again\.$/);
    expect((await rejection(declineInvitation({ user: null, token }, later))).details?.reason).toBe('expired');
    expect(await getInvitation({ user: invitee, token }, later)).toMatchObject({ status: 'expired' });
    expect((await rolesOf(lab.groupId))[invitee.id]).toBeUndefined();
  });

  it('tampered, truncated and guessed tokens are not found', async () => {
    const { token } = await invitedToken(uniqueEmail('tamper'));
    const flipped = token.slice(0, 20) + (token[20] === 'A' ? 'B' : 'A') + token.slice(21);
    for (const t of [flipped, token.slice(0, 42), `${token}A`, '', '../etc/passwd']) {
      expect(await getInvitation({ user: null, token: t })).toEqual({ status: 'not_found' });
      const e = await rejection(acceptInvitation({ user: lab.outsider, token: t }));
      expect([e.status, e.message]).toEqual([404, INVALID_INVITATION]);
    }
  });
});

describe('declining and revoking', () => {
  it('the link alone declines (no account needed); audited as anonymous; accepting afterwards is refused', async () => {
    const email = uniqueEmail('declines');
    const { token, id } = await invitedToken(email);
    expect(await declineInvitation({ user: null, token })).toEqual({ groupSlug: lab.slug, groupName: lab.name });
    expect(await db()('group_invitations').where('id', id).whereNotNull('declined_at').count({ n: '*' })).toEqual([{ n: 1 }]);
    expect((await auditOf(lab.groupId, 'group.invitation_declined')).find((a) => a.target_id === id)).toMatchObject({ actor_kind: 'anonymous', actor_user_id: null });
    const invitee = await labUser(lab, 'Ysabel Thornquist', { email });
    expect((await rejection(acceptInvitation({ user: invitee, token }))).details?.reason).toBe('declined');
    expect(await getInvitation({ user: null, token })).toMatchObject({ status: 'declined' });
  });

  it('an owner revokes an open invitation: the link stops working; audited; members cannot revoke', async () => {
    const { token, id } = await invitedToken(uniqueEmail('revoked'));
    expect((await rejection(revokeInvitation({ user: lab.member, slug: lab.slug, invitationId: id }))).status).toBe(403);
    expect(await revokeInvitation({ user: lab.owner, slug: lab.slug, invitationId: id })).toEqual({ revoked: true });
    expect(await getInvitation({ user: null, token })).toEqual({ status: 'not_found' });
    expect((await auditOf(lab.groupId, 'group.invitation_revoked')).map((a) => a.target_id)).toContain(id);
    expect((await rejection(revokeInvitation({ user: lab.owner, slug: lab.slug, invitationId: id }))).status).toBe(404);
  });

  it('a curator cannot withdraw an owner invitation', async () => {
    const { id } = await invitedToken(uniqueEmail('owner-invite'), 'owner');
    const e = await rejection(revokeInvitation({ user: lab.curator, slug: lab.slug, invitationId: id }));
    expect([e.status, e.message]).toEqual([403, 'Only owners can withdraw an invitation to become owner.']);
  });
});

describe('a down SMTP relay only delays the mail', () => {
  it('the invitation is stored and queued; the outbox delivers it once the relay answers', async () => {
    const email = uniqueEmail('delayed');
    const down = publishingOutboxHandlers({ mail: { smtpUrl: await closedPortUrl(), timeoutMs: 2000 } });
    const since = new Date(Date.now() - 1000);
    const result = await inviteMember({ user: lab.owner, slug: lab.slug, input: { email, role: 'member' } }, { handlers: down });
    expect(result.delivery).toBe('queued');
    const job = await db()('outbox').where({ aggregate_id: result.invitation.id, topic: 'mail.send' }).first('processed_at', 'last_error', 'attempts');
    expect(job.processed_at).toBeNull();
    expect(job.attempts).toBe(1);
    expect(job.last_error).toMatch(/ECONNREFUSED|connect/i);
    expect((await readMailbox()).filter((m) => m.to.includes(email))).toEqual([]);

    await drainInvitationMail(result.invitation.id, real);
    const mail = await waitForMail({ to: email, subject: subjectOf(lab), since });
    const token = tokenFromLinks(mail.links);
    expect(await getInvitation({ user: null, token })).toMatchObject({ status: 'pending', email });
  });
});
