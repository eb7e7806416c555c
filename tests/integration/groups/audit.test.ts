// The audit log viewer against MariaDB: who sees which entries, the filters (action, actor, target, UTC day range)
// and paging. Rules: issue 8 item 3 (curators see their group, admins all) and 'view_access_log' in lib/access.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listAuditEntries, parseAuditQuery } from '@/lib/audit/list-audit';
import { db } from '@/lib/db';
import { changeMemberRole } from '@/lib/groups/change-role';
import { closeDb, labUser, makeGroupLab, rejection, removeGroupLab, type GroupLab } from './fixtures';

let lab: GroupLab;
let other: GroupLab;
const at = (iso: string) => new Date(iso);

beforeAll(async () => {
  lab = await makeGroupLab('audit');
  other = await makeGroupLab('audit-other');
  // Entries on fixed days (UTC) to filter by date; the target is a dataset version of the lab.
  const versionId = randomUUID();
  await db()('audit_log').insert([
    { action: 'version.publish', actor_kind: 'user', actor_user_id: lab.curator.id, group_id: lab.groupId, target_type: 'dataset_version', target_id: versionId, created_at: at('2026-03-01T23:59:59.999Z') },
    { action: 'version.withdraw', actor_kind: 'user', actor_user_id: lab.owner.id, group_id: lab.groupId, target_type: 'dataset_version', target_id: versionId, created_at: at('2026-03-02T00:00:00.000Z') },
    { action: 'reviewer_link.use', actor_kind: 'reviewer', actor_user_id: null, group_id: lab.groupId, target_type: 'reviewer_link', target_id: randomUUID(), created_at: at('2026-03-03T12:00:00.000Z') },
    { action: 'version.publish', actor_kind: 'user', actor_user_id: other.owner.id, group_id: other.groupId, target_type: 'dataset_version', target_id: randomUUID(), created_at: at('2026-03-02T08:00:00.000Z') },
  ]);
  await changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.member.id, input: { role: 'curator' } });
  await changeMemberRole({ user: lab.owner, slug: lab.slug, userId: lab.member.id, input: { role: 'member' } });
});
afterAll(async () => {
  await removeGroupLab(lab);
  await removeGroupLab(other);
  await closeDb();
});

const q = (extra: Record<string, string> = {}) => parseAuditQuery({ group: lab.slug, ...extra });

describe('scope', () => {
  it('a curator sees their own group’s entries only, newest first, with actor and target names', async () => {
    const page = await listAuditEntries({ viewer: lab.curator, query: q() });
    expect(page.scope).toEqual({ kind: 'group', slug: lab.slug, name: lab.name });
    expect(page.entries.map((e) => e.action)).toEqual(['group.member_role_changed', 'group.member_role_changed', 'reviewer_link.use', 'version.withdraw', 'version.publish']);
    expect(page.total).toBe(5);
    expect(page.entries.every((e) => e.group?.slug === lab.slug)).toBe(true);
    expect(page.entries[0]).toMatchObject({
      actorKind: 'user', actor: { id: lab.owner.id, name: lab.owner.name, email: lab.owner.email },
      target: { type: 'user', id: lab.member.id, name: lab.member.name }, details: { from: 'curator', to: 'member' },
    });
    expect(page.entries[2]).toMatchObject({ actorKind: 'reviewer', actor: null });
    expect(page.actions).toEqual(['group.member_role_changed', 'reviewer_link.use', 'version.publish', 'version.withdraw']);
  });

  it('members and outsiders are refused (403); a curator without ?group is refused; anonymous is 401', async () => {
    for (const viewer of [lab.member, lab.outsider, other.curator]) {
      const e = await rejection(listAuditEntries({ viewer, query: q() }));
      expect([e.status, e.message]).toEqual([403, `Only curators and owners of ${lab.name} (and site admins) see its audit log.`]);
    }
    const all = await rejection(listAuditEntries({ viewer: lab.curator, query: parseAuditQuery({}) }));
    expect(all.status).toBe(403);
    expect((await rejection(listAuditEntries({ viewer: null, query: q() }))).status).toBe(401);
  });

  it('a site admin sees every group’s entries without naming one', async () => {
    const page = await listAuditEntries({ viewer: lab.admin, query: parseAuditQuery({ from: '2026-03-02', to: '2026-03-02', action: 'version.publish' }) });
    expect(page.scope).toEqual({ kind: 'all' });
    const ours = page.entries.filter((e) => [lab.slug, other.slug].includes(e.group?.slug ?? ''));
    expect(ours.map((e) => [e.group?.slug, e.actor?.id])).toEqual([[other.slug, other.owner.id]]);
  });
});

describe('filters', () => {
  it('by UTC day range: from and to are whole days, both included', async () => {
    const day2 = await listAuditEntries({ viewer: lab.owner, query: q({ from: '2026-03-02', to: '2026-03-02' }) });
    expect(day2.entries.map((e) => [e.action, e.at])).toEqual([['version.withdraw', '2026-03-02T00:00:00.000Z']]);
    const upTo2 = await listAuditEntries({ viewer: lab.owner, query: q({ to: '2026-03-02' }) });
    expect(upTo2.entries.map((e) => e.action)).toEqual(['version.withdraw', 'version.publish']);
    const bad = await rejection(Promise.resolve().then(() => q({ from: '2026-03-05', to: '2026-03-01' })));
    expect([bad.status, bad.details?.fieldErrors?.to]).toEqual([422, 'Choose a day on or after the first day.']);
    expect((await rejection(Promise.resolve().then(() => q({ from: '1 March' }))))?.status).toBe(422);
  });

  it('by action, by actor (id, e-mail or part of the name) and by target', async () => {
    const byAction = await listAuditEntries({ viewer: lab.owner, query: q({ action: 'version.publish' }) });
    expect(byAction.entries.map((e) => e.actor?.id)).toEqual([lab.curator.id]);
    for (const actor of [lab.owner.id, lab.owner.email.toUpperCase(), lab.owner.name.split(' ')[1]]) {
      const page = await listAuditEntries({ viewer: lab.owner, query: q({ actor }) });
      expect([actor, page.entries.map((e) => e.action)]).toEqual([actor, ['group.member_role_changed', 'group.member_role_changed', 'version.withdraw']]);
    }
    const byTarget = await listAuditEntries({ viewer: lab.owner, query: q({ targetType: 'user', targetId: lab.member.id }) });
    expect(byTarget.total).toBe(2);
    const none = await listAuditEntries({ viewer: lab.owner, query: q({ actor: 'nobody-by-this-name' }) });
    expect([none.total, none.entries, none.pageCount]).toEqual([0, [], 1]);
  });

  it('a LIKE wildcard in the actor filter is taken literally', async () => {
    const page = await listAuditEntries({ viewer: lab.owner, query: q({ actor: '%' }) });
    expect(page.total).toBe(0);
  });
});

describe('paging', () => {
  it('pages of the chosen size, in order, with the total; a page past the end shows the last page', async () => {
    const p1 = await listAuditEntries({ viewer: lab.owner, query: q({ pageSize: '2' }) });
    const p2 = await listAuditEntries({ viewer: lab.owner, query: q({ pageSize: '2', page: '2' }) });
    const p3 = await listAuditEntries({ viewer: lab.owner, query: q({ pageSize: '2', page: '3' }) });
    expect([p1.total, p1.pageCount, p1.entries.length, p2.entries.length, p3.entries.length]).toEqual([5, 3, 2, 2, 1]);
    const ids = [...p1.entries, ...p2.entries, ...p3.entries].map((e) => e.id);
    expect(new Set(ids).size).toBe(5);
    expect(p3.entries[0].action).toBe('version.publish');
    const beyond = await listAuditEntries({ viewer: lab.owner, query: q({ pageSize: '2', page: '40' }) });
    expect(beyond.page).toBe(3);
    expect((await rejection(Promise.resolve().then(() => q({ pageSize: '0' })))).status).toBe(422);
    const capped = await listAuditEntries({ viewer: lab.owner, query: q({ pageSize: '999' }) });
    expect(capped.pageSize).toBe(200);
  });

  it('a newcomer promoted to curator sees the log from then on', async () => {
    const newcomer = await labUser(lab, 'Caspian Mereworth');
    await db()('memberships').insert({ group_id: lab.groupId, user_id: newcomer.id, role: 'member' });
    expect((await rejection(listAuditEntries({ viewer: newcomer, query: q() }))).status).toBe(403);
    await changeMemberRole({ user: lab.owner, slug: lab.slug, userId: newcomer.id, input: { role: 'curator' } });
    expect((await listAuditEntries({ viewer: newcomer, query: q() })).total).toBe(6);
  });
});
