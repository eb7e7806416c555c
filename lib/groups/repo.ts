import 'server-only';
import { db } from '@/lib/db';
import type { GroupRole } from '@/lib/access';
import { insertAudit } from '@/lib/audit/repo';

export type GroupRow = { id: string; slug: string; name: string; description: string | null; institution: string | null; storage_quota_bytes: number; storage_used_bytes: number };
export type MemberRow = { user_id: string; name: string; email: string; orcid: string | null; role: GroupRole };

export async function listGroups(): Promise<(GroupRow & { member_count: number; dataset_count: number })[]> {
  return db()('groups as g')
    .select('g.*')
    .select(db().raw('(SELECT COUNT(*) FROM memberships m WHERE m.group_id = g.id) AS member_count'))
    .select(db().raw('(SELECT COUNT(*) FROM datasets d WHERE d.group_id = g.id) AS dataset_count'))
    .orderBy('g.name');
}

export async function findGroupBySlug(slug: string): Promise<GroupRow | undefined> {
  return db()<GroupRow>('groups').where({ slug }).first();
}

export async function listMembers(groupId: string): Promise<MemberRow[]> {
  return db()('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.group_id', groupId)
    .select('u.id as user_id', 'u.name', 'u.email', 'u.orcid', 'm.role')
    .orderByRaw("FIELD(m.role, 'owner', 'curator', 'member'), u.name");
}

export async function groupRoleOf(userId: string, groupId: string): Promise<GroupRole | undefined> {
  const row = await db()('memberships').where({ user_id: userId, group_id: groupId }).first('role');
  return row?.role;
}

export async function groupsOfUser(userId: string): Promise<(GroupRow & { role: GroupRole })[]> {
  return db()('memberships as m').join('groups as g', 'g.id', 'm.group_id').where('m.user_id', userId).select('g.*', 'm.role').orderBy('g.name');
}

// ——— Group administration (issue 8): creation, published datasets, quota ———

export async function findGroupById(id: string): Promise<GroupRow | undefined> {
  return db()<GroupRow>('groups').where({ id }).first();
}

/** Slugs equal to `base` or of the form `base-…`, to pick a free one. */
export async function listSlugsLike(base: string): Promise<string[]> {
  const escaped = base.replace(/[\\%_]/g, (c) => `\\${c}`);
  return db()('groups').where('slug', base).orWhereRaw('slug LIKE ?', [`${escaped}-%`]).pluck('slug');
}

export type NewGroup = { id: string; slug: string; name: string; institution: string | null; description: string | null; ownerId: string };

/** True when the error is MariaDB's duplicate-key refusal (ER_DUP_ENTRY), e.g. a slug taken meanwhile. */
export function isDuplicateKey(error: unknown): boolean {
  return (error as { code?: string } | null)?.code === 'ER_DUP_ENTRY';
}

/** The group, its first owner and the audit entry, in one transaction. Throws ER_DUP_ENTRY when the slug is taken. */
export async function insertGroupWithOwner(g: NewGroup): Promise<void> {
  await db().transaction(async (trx) => {
    await trx('groups').insert({ id: g.id, slug: g.slug, name: g.name, institution: g.institution, description: g.description });
    await trx('memberships').insert({ group_id: g.id, user_id: g.ownerId, role: 'owner' });
    await insertAudit({
      action: 'group.create', actorKind: 'user', actorUserId: g.ownerId, groupId: g.id, targetType: 'group', targetId: g.id,
      details: { slug: g.slug, name: g.name },
    }, trx);
  });
}

export type GroupDatasetRow = {
  dataset_id: string; version_id: string; title: string; version_number: number; doi: string | null;
  published_at: Date | null; embargo_until: string | null;
};

/** Each dataset of the group with a published version, shown by its latest published version, newest first. */
export async function listPublishedDatasets(groupId: string, limit = 200): Promise<GroupDatasetRow[]> {
  return db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .where({ 'd.group_id': groupId, 'v.state': 'published' })
    .whereRaw("v.version_number = (SELECT MAX(v2.version_number) FROM dataset_versions v2 WHERE v2.dataset_id = v.dataset_id AND v2.state = 'published')")
    .orderBy([{ column: 'v.published_at', order: 'desc' }, { column: 'v.id', order: 'asc' }])
    .limit(limit)
    .select('d.id as dataset_id', 'v.id as version_id', 'v.title', 'v.version_number', 'v.doi', 'v.published_at',
      db().raw("DATE_FORMAT(v.embargo_until, '%Y-%m-%d') as embargo_until"));
}

/** Sets the group's quota and records who did it, in one transaction. */
export async function updateStorageQuota(groupId: string, quotaBytes: number, actorUserId: string): Promise<{ before: number } | undefined> {
  return db().transaction(async (trx) => {
    const row = await trx('groups').where({ id: groupId }).forUpdate().first('storage_quota_bytes');
    if (!row) return undefined;
    await trx('groups').where({ id: groupId }).update({ storage_quota_bytes: quotaBytes, updated_at: trx.fn.now() });
    const before = Number(row.storage_quota_bytes);
    await insertAudit({
      action: 'group.quota_changed', actorKind: 'user', actorUserId, groupId, targetType: 'group', targetId: groupId,
      details: { fromBytes: before, toBytes: quotaBytes },
    }, trx);
    return { before };
  });
}

export async function countsOfGroup(groupId: string): Promise<{ memberCount: number; datasetCount: number }> {
  const [members, datasets] = await Promise.all([
    db()('memberships').where({ group_id: groupId }).count({ n: '*' }).first(),
    db()('datasets').where({ group_id: groupId }).count({ n: '*' }).first(),
  ]);
  return { memberCount: Number(members?.n ?? 0), datasetCount: Number(datasets?.n ?? 0) };
}
