// Roles, removal, leaving and ownership transfer against MariaDB; the group never has zero owners.
// Rules: issue 8 item 3 and lib/access/permissions.ts (manage_members: owners and site admins only).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { changeMemberRole } from '@/lib/groups/change-role';
import { removeMember } from '@/lib/groups/remove-member';
import { LAST_OWNER_MESSAGE } from '@/lib/groups/repo-members';
import { transferOwnership } from '@/lib/groups/transfer-ownership';
import { auditOf, closeDb, labUser, makeGroupLab, rejection, removeGroupLab, rolesOf, type GroupLab, type LabUser } from './fixtures';

let lab: GroupLab;

beforeAll(async () => {
  lab = await makeGroupLab('members');
});
afterAll(async () => {
  await removeGroupLab(lab);
  await closeDb();
});

async function addMember(name: string, role: 'owner' | 'curator' | 'member'): Promise<LabUser> {
  const u = await labUser(lab, name);
  await db()('memberships').insert({ group_id: lab.groupId, user_id: u.id, role });
  return u;
}

describe('changeMemberRole', () => {
  it('an owner promotes a member to curator; the change is audited with from and to', async () => {
    const u = await addMember('Rhoswen Tallack', 'member');
    const result = await changeMemberRole({ user: lab.owner, slug: lab.slug, userId: u.id, input: { role: 'curator' } });
    expect(result).toEqual({ member: { userId: u.id, name: 'Rhoswen Tallack', role: 'curator' }, from: 'member', changed: true });
    expect((await rolesOf(lab.groupId))[u.id]).toBe('curator');
    const audit = (await auditOf(lab.groupId, 'group.member_role_changed')).filter((a) => a.target_id === u.id);
    expect(audit).toEqual([{
      action: 'group.member_role_changed', actor_user_id: lab.owner.id, actor_kind: 'user', target_type: 'user', target_id: u.id,
      details: { from: 'member', to: 'curator', name: 'Rhoswen Tallack' },
    }]);
  });

  it('setting the role a member already has changes nothing and writes no audit entry', async () => {
    const before = (await auditOf(lab.groupId)).length;
    const result = await changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.member.id, input: { role: 'member' } });
    expect(result.changed).toBe(false);
    expect((await auditOf(lab.groupId)).length).toBe(before);
  });

  it('curators and members cannot change roles (403), so a curator cannot demote an owner', async () => {
    const curatorTry = await rejection(changeMemberRole({ user: lab.curator, slug: lab.slug, userId: lab.owner.id, input: { role: 'member' } }));
    expect([curatorTry.status, curatorTry.message]).toEqual([403, `Only owners of ${lab.name} (and site admins) can change roles.`]);
    const memberTry = await rejection(changeMemberRole({ user: lab.member, slug: lab.slug, userId: lab.member.id, input: { role: 'owner' } }));
    expect(memberTry.status).toBe(403);
    const outsiderTry = await rejection(changeMemberRole({ user: lab.outsider, slug: lab.slug, userId: lab.member.id, input: { role: 'curator' } }));
    expect(outsiderTry.status).toBe(403);
    const anonymous = await rejection(changeMemberRole({ user: null, slug: lab.slug, userId: lab.member.id, input: { role: 'curator' } }));
    expect(anonymous.status).toBe(401);
    expect((await rolesOf(lab.groupId))[lab.owner.id]).toBe('owner');
  });

  it('a site admin who is not in the group may change roles', async () => {
    const u = await addMember('Anselm Corry', 'member');
    await changeMemberRole({ user: lab.admin, slug: lab.slug, userId: u.id, input: { role: 'curator' } });
    expect((await rolesOf(lab.groupId))[u.id]).toBe('curator');
  });

  it('refuses an unknown role (422), a non-member (404) and an unknown group (404)', async () => {
    const bad = await rejection(changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.member.id, input: { role: 'boss' } }));
    expect([bad.status, bad.details?.fieldErrors?.role]).toEqual([422, 'Choose member, curator or owner.']);
    const stranger = await rejection(changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.outsider.id, input: { role: 'curator' } }));
    expect([stranger.status, stranger.message]).toEqual([404, `This person is not a member of ${lab.name}.`]);
    const nowhere = await rejection(changeMemberRole({ user: lab.owner, slug: 'no-such-group-anywhere', userId: lab.member.id, input: { role: 'curator' } }));
    expect(nowhere.status).toBe(404);
  });

  it('the only owner cannot step down (409) and the group keeps its owner', async () => {
    const e = await rejection(changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.owner.id, input: { role: 'curator' } }));
    expect([e.status, e.message, e.details?.reason]).toEqual([409, LAST_OWNER_MESSAGE, 'last_owner']);
    expect((await rolesOf(lab.groupId))[lab.owner.id]).toBe('owner');
  });
});

describe('zero owners never happens, also under concurrency', () => {
  it('two owners stepping down at the same moment: one succeeds, the other is refused with 409', async () => {
    const a = await labUser(lab, 'Tove Harrowby');
    const b = await labUser(lab, 'Eamon Prestwick');
    const groupId = randomGroupId();
    const slug = `members-pair-${groupId.slice(0, 8)}`;
    await db()('groups').insert({ id: groupId, slug, name: 'Two-owner bench (invented)' });
    lab.extraGroupIds.push(groupId);
    await db()('memberships').insert([{ group_id: groupId, user_id: a.id, role: 'owner' }, { group_id: groupId, user_id: b.id, role: 'owner' }]);

    const outcomes = await Promise.allSettled([
      changeMemberRole({ user: a, slug, userId: a.id, input: { role: 'curator' } }),
      changeMemberRole({ user: b, slug, userId: b.id, input: { role: 'curator' } }),
    ]);
    expect(outcomes.map((o) => o.status).sort()).toEqual(['fulfilled', 'rejected']);
    const refused = outcomes.find((o): o is PromiseRejectedResult => o.status === 'rejected')!.reason as { status: number; message: string };
    expect([refused.status, refused.message]).toEqual([409, LAST_OWNER_MESSAGE]);
    const roles = Object.values(await rolesOf(groupId)).sort();
    expect(roles).toEqual(['curator', 'owner']);
  });

  it('two owners demoting each other at the same moment: exactly one owner remains', async () => {
    const a = await labUser(lab, 'Linnea Coldharbour');
    const b = await labUser(lab, 'Ferris Undercliffe');
    const groupId = randomGroupId();
    const slug = `members-cross-${groupId.slice(0, 8)}`;
    await db()('groups').insert({ id: groupId, slug, name: 'Cross-demotion bench (invented)' });
    lab.extraGroupIds.push(groupId);
    await db()('memberships').insert([{ group_id: groupId, user_id: a.id, role: 'owner' }, { group_id: groupId, user_id: b.id, role: 'owner' }]);

    const outcomes = await Promise.allSettled([
      changeMemberRole({ user: a, slug, userId: b.id, input: { role: 'member' } }),
      changeMemberRole({ user: b, slug, userId: a.id, input: { role: 'member' } }),
    ]);
    expect(outcomes.map((o) => o.status).sort()).toEqual(['fulfilled', 'rejected']);
    // The loser was demoted before its turn, so it is no longer allowed at all (checked under the lock).
    const refused = outcomes.find((o): o is PromiseRejectedResult => o.status === 'rejected')!.reason as { status: number };
    expect(refused.status).toBe(403);
    expect(Object.values(await rolesOf(groupId)).sort()).toEqual(['member', 'owner']);
    expect((await auditOf(groupId, 'group.member_role_changed')).length).toBe(1);
  });
});

describe('removeMember', () => {
  it('an owner removes a member; audited as group.member_removed', async () => {
    const u = await addMember('Mirela Stanbury', 'member');
    expect(await removeMember({ user: lab.owner, slug: lab.slug, userId: u.id })).toEqual({ userId: u.id, role: 'member', left: false });
    expect((await rolesOf(lab.groupId))[u.id]).toBeUndefined();
    expect((await auditOf(lab.groupId, 'group.member_removed')).find((a) => a.target_id === u.id)?.details).toEqual({ role: 'member', name: 'Mirela Stanbury' });
  });

  it('a member may leave on their own; audited as group.member_left', async () => {
    const u = await addMember('Osric Penhale', 'member');
    expect(await removeMember({ user: u, slug: lab.slug, userId: u.id })).toEqual({ userId: u.id, role: 'member', left: true });
    const left = (await auditOf(lab.groupId, 'group.member_left')).find((a) => a.target_id === u.id);
    expect(left?.actor_user_id).toBe(u.id);
  });

  it('curators and members cannot remove others (403); outsiders neither', async () => {
    for (const actor of [lab.curator, lab.member, lab.outsider]) {
      const e = await rejection(removeMember({ user: actor, slug: lab.slug, userId: lab.member.id === actor.id ? lab.curator.id : lab.member.id }));
      expect(e.status).toBe(403);
    }
    expect(Object.keys(await rolesOf(lab.groupId))).toEqual(expect.arrayContaining([lab.owner.id, lab.curator.id, lab.member.id]));
  });

  it('the only owner can neither leave nor be removed by an admin (409)', async () => {
    const leave = await rejection(removeMember({ user: lab.owner, slug: lab.slug, userId: lab.owner.id }));
    expect([leave.status, leave.message]).toEqual([409, LAST_OWNER_MESSAGE]);
    const byAdmin = await rejection(removeMember({ user: lab.admin, slug: lab.slug, userId: lab.owner.id }));
    expect(byAdmin.status).toBe(409);
    expect((await rolesOf(lab.groupId))[lab.owner.id]).toBe('owner');
  });
});

describe('transferOwnership', () => {
  it('the owner hands over to a member and becomes curator, in one step, audited once', async () => {
    const groupId = randomGroupId();
    const slug = `members-transfer-${groupId.slice(0, 8)}`;
    const from = await labUser(lab, 'Gwenllian Aske');
    const to = await labUser(lab, 'Bram Oakenshaw');
    await db()('groups').insert({ id: groupId, slug, name: 'Transfer bench (invented)' });
    lab.extraGroupIds.push(groupId);
    await db()('memberships').insert([{ group_id: groupId, user_id: from.id, role: 'owner' }, { group_id: groupId, user_id: to.id, role: 'member' }]);

    const result = await transferOwnership({ user: from, slug, input: { userId: to.id } });
    expect(result).toEqual({ newOwner: { userId: to.id, name: 'Bram Oakenshaw', role: 'owner' }, formerOwner: { userId: from.id, name: 'Gwenllian Aske', role: 'curator' } });
    expect(await rolesOf(groupId)).toEqual({ [from.id]: 'curator', [to.id]: 'owner' });
    expect(await auditOf(groupId, 'group.ownership_transferred')).toEqual([{
      action: 'group.ownership_transferred', actor_user_id: from.id, actor_kind: 'user', target_type: 'user', target_id: to.id,
      details: { to: 'Bram Oakenshaw', targetFormerRole: 'member', formerOwnerRole: 'curator' },
    }]);

    // The former owner is no longer allowed to hand over; the new owner may, stepping down to member.
    expect((await rejection(transferOwnership({ user: from, slug, input: { userId: to.id } }))).status).toBe(403);
    await transferOwnership({ user: to, slug, input: { userId: from.id, formerOwnerRole: 'member' } });
    expect(await rolesOf(groupId)).toEqual({ [from.id]: 'owner', [to.id]: 'member' });
  });

  it('refuses non-owners (403, the site admin too), a non-member target (404) and oneself (422)', async () => {
    for (const actor of [lab.curator, lab.member, lab.admin]) {
      expect((await rejection(transferOwnership({ user: actor, slug: lab.slug, input: { userId: lab.member.id } }))).status).toBe(403);
    }
    expect((await rejection(transferOwnership({ user: lab.owner, slug: lab.slug, input: { userId: lab.outsider.id } }))).status).toBe(404);
    const self = await rejection(transferOwnership({ user: lab.owner, slug: lab.slug, input: { userId: lab.owner.id } }));
    expect([self.status, self.details?.fieldErrors?.userId]).toEqual([422, 'Choose another member; you are an owner already.']);
    const bad = await rejection(transferOwnership({ user: lab.owner, slug: lab.slug, input: { userId: 'not-a-uuid' } }));
    expect(bad.status).toBe(422);
    expect((await rolesOf(lab.groupId))[lab.owner.id]).toBe('owner');
  });
});

function randomGroupId(): string {
  return randomUUID();
}
