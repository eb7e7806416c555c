// Creating groups, the group page's data (published datasets, storage for insiders) and quotas, against MariaDB.
// Rules: issue 8 item 3 (any signed-in user creates a group and owns it; slug from the name, unique, 3–80 characters).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createGroup } from '@/lib/groups/create-group';
import { setStorageQuota } from '@/lib/groups/group-storage';
import { getGroupDetail, listGroupSummaries } from '@/lib/groups/list-groups';
import { getMembersView } from '@/lib/groups/get-members-view';
import { auditOf, closeDb, labUser, makeGroupLab, rejection, removeGroupLab, rolesOf, type GroupLab } from './fixtures';

let lab: GroupLab;

beforeAll(async () => {
  lab = await makeGroupLab('create');
});
afterAll(async () => {
  await removeGroupLab(lab);
  await closeDb();
});

async function created(name: string, extra: Record<string, string> = {}) {
  const group = await createGroup({ user: lab.outsider, input: { name, ...extra } });
  lab.extraGroupIds.push(group.id);
  return group;
}

describe('createGroup', () => {
  it('a signed-in user without any group creates one and becomes its only owner; audited as group.create', async () => {
    const tag = randomUUID().slice(0, 8);
    const group = await created(`  Quarrywick Ørsted Lab ${tag}  `, { institution: 'Quarrywick College (invented)', description: '' });
    expect(group).toEqual({ id: group.id, slug: `quarrywick-orsted-lab-${tag}`, name: `Quarrywick Ørsted Lab ${tag}` });
    expect(await rolesOf(group.id)).toEqual({ [lab.outsider.id]: 'owner' });
    const row = await db()('groups').where('id', group.id).first('institution', 'description', 'storage_quota_bytes', 'storage_used_bytes');
    expect(row).toEqual({ institution: 'Quarrywick College (invented)', description: null, storage_quota_bytes: 50 * 1024 ** 3, storage_used_bytes: 0 });
    expect(await auditOf(group.id)).toEqual([{
      action: 'group.create', actor_user_id: lab.outsider.id, actor_kind: 'user', target_type: 'group', target_id: group.id,
      details: { slug: group.slug, name: group.name },
    }]);
  });

  it('a second group of the same name gets the next free address (-2, then -3)', async () => {
    const name = `Thistledown Transport ${randomUUID().slice(0, 8)}`;
    const a = await created(name);
    const b = await created(name);
    const c = await created(name);
    expect([b.slug, c.slug]).toEqual([`${a.slug}-2`, `${a.slug}-3`]);
  });

  it('takes a chosen address, refuses it when taken (409) or malformed or reserved (422)', async () => {
    const slug = `mossgrave-${randomUUID().slice(0, 8)}`;
    expect((await created('Mossgrave Lab (invented)', { slug })).slug).toBe(slug);
    const taken = await rejection(createGroup({ user: lab.outsider, input: { name: 'Another Mossgrave', slug } }));
    expect([taken.status, taken.details?.fieldErrors?.slug]).toEqual([409, `The address "${slug}" is taken; choose another.`]);
    for (const bad of ['Caps-Not-Allowed', 'ab', 'double--hyphen', '-leading', 'x'.repeat(81)]) {
      const e = await rejection(createGroup({ user: lab.outsider, input: { name: 'Valid name', slug: bad } }));
      expect([bad, e.status, Object.keys(e.details?.fieldErrors ?? {})]).toEqual([bad, 422, ['slug']]);
    }
    const reserved = await rejection(createGroup({ user: lab.outsider, input: { name: 'New', slug: 'new' } }));
    expect(reserved.details?.fieldErrors?.slug).toBe('"new" is the name of a page on Ohmstead; choose another.');
  });

  it('refuses a short or missing name (422), unknown fields (422) and anonymous callers (401)', async () => {
    const short = await rejection(createGroup({ user: lab.outsider, input: { name: ' Q ' } }));
    expect([short.status, short.details?.fieldErrors?.name]).toEqual([422, 'Give the group a name of 3 to 200 characters.']);
    expect((await rejection(createGroup({ user: lab.outsider, input: {} }))).details?.fieldErrors?.name).toBe('Give the group a name of 3 to 200 characters.');
    expect((await rejection(createGroup({ user: lab.outsider, input: { name: 'Fine name', owner: 'x' } }))).status).toBe(422);
    expect((await rejection(createGroup({ user: null, input: { name: 'Fine name' } }))).status).toBe(401);
  });

  it('a name with no letters a–z gets a neutral address', async () => {
    const group = await created('Λ-ΩΩΩ');
    expect(group.slug).toMatch(/^group-[0-9a-f]{8}$/);
  });
});

describe('group detail and storage', () => {
  it('lists the latest published version of each dataset, not drafts; storage only for insiders', async () => {
    const datasetId = randomUUID();
    const draftOnly = randomUUID();
    await db()('datasets').insert([{ id: datasetId, group_id: lab.groupId }, { id: draftOnly, group_id: lab.groupId }]);
    const day = (d: number) => new Date(Date.UTC(2026, 10, d));
    await db()('dataset_versions').insert([
      { id: randomUUID(), dataset_id: datasetId, version_number: 1, state: 'published', title: 'ρ(T) of a tin whisker, v1', metadata: '{}', published_at: day(1), doi: `10.80123/ohm.t${randomUUID().slice(0, 3)}-v001` },
      { id: randomUUID(), dataset_id: datasetId, version_number: 2, state: 'published', title: 'ρ(T) of a tin whisker, v2', metadata: '{}', published_at: day(9), embargo_until: '2027-01-15' },
      { id: randomUUID(), dataset_id: datasetId, version_number: 3, state: 'draft', title: 'ρ(T) of a tin whisker, v3 draft', metadata: '{}' },
      { id: randomUUID(), dataset_id: draftOnly, version_number: 1, state: 'draft', title: 'Unpublished draft', metadata: '{}' },
    ]);
    await db()('groups').where('id', lab.groupId).update({ storage_used_bytes: 1_610_612_736, storage_quota_bytes: 2_147_483_648 }); // 1.5 GiB of 2 GiB

    const forMember = await getGroupDetail({ user: lab.member, slug: lab.slug });
    expect(forMember.datasets).toEqual([{
      datasetId, title: 'ρ(T) of a tin whisker, v2', versionNumber: 2, doi: null, publishedAt: day(9).toISOString(), embargoUntil: '2027-01-15', url: `/datasets/${datasetId}`,
    }]);
    expect(forMember).toMatchObject({ memberCount: 3, datasetCount: 2, yourRole: 'member' });
    // 1.5 GiB / 2 GiB = 75 %; 0.5 GiB free (IEC binary prefixes).
    expect(forMember.storage).toEqual({
      usedBytes: 1_610_612_736, quotaBytes: 2_147_483_648, freeBytes: 536_870_912, percentUsed: 75, level: 'ok', summary: '1.50 GiB of 2.00 GiB used (75 %), 512.0 MiB free',
    });
    expect((await getGroupDetail({ user: lab.outsider, slug: lab.slug })).storage).toBeNull();
    expect((await getGroupDetail({ user: null, slug: lab.slug })).storage).toBeNull();
    expect((await getGroupDetail({ user: lab.admin, slug: lab.slug })).storage?.percentUsed).toBe(75);
    expect((await listGroupSummaries(lab.curator)).find((g) => g.slug === lab.slug)).toMatchObject({ yourRole: 'curator', memberCount: 3 });
  });

  it('only site admins set a quota (audited); the members page shows the new figure', async () => {
    expect((await rejection(setStorageQuota({ user: lab.owner, slug: lab.slug, input: { storageQuotaBytes: 4 * 1024 ** 3 } }))).status).toBe(403);
    const storage = await setStorageQuota({ user: lab.admin, slug: lab.slug, input: { storageQuotaBytes: 4 * 1024 ** 3 } });
    expect(storage.quotaBytes).toBe(4 * 1024 ** 3);
    expect((await auditOf(lab.groupId, 'group.quota_changed'))[0]).toMatchObject({ actor_user_id: lab.admin.id, details: { fromBytes: 2_147_483_648, toBytes: 4 * 1024 ** 3 } });
    expect((await getMembersView({ user: lab.owner, slug: lab.slug })).storage?.summary).toBe('1.50 GiB of 4.00 GiB used (37.5 %), 2.50 GiB free');
    const bad = await rejection(setStorageQuota({ user: lab.admin, slug: lab.slug, input: { storageQuotaBytes: 12 } }));
    expect(bad.status).toBe(422);
  });

  it('the members view shows addresses and invitations to insiders only', async () => {
    const outsiderView = await getMembersView({ user: lab.outsider, slug: lab.slug });
    expect(outsiderView.access).toBe('public');
    expect(outsiderView.members.every((m) => m.email === undefined)).toBe(true);
    expect(outsiderView.can).toEqual({ manageMembers: false, invite: false, viewAudit: false, transferOwnership: false });
    const curatorView = await getMembersView({ user: lab.curator, slug: lab.slug });
    expect(curatorView.can).toEqual({ manageMembers: false, invite: true, viewAudit: true, transferOwnership: false });
    expect(curatorView.invitableRoles).toEqual(['curator', 'member']);
    const memberView = await getMembersView({ user: lab.member, slug: lab.slug });
    expect([memberView.access, memberView.can.invite, memberView.members.find((m) => m.userId === lab.owner.id)?.email]).toEqual(['full', false, lab.owner.email]);
    const newcomer = await labUser(lab, 'Orla Brightwater');
    expect((await getMembersView({ user: newcomer, slug: lab.slug })).viewerRole).toBeNull();
  });
});
