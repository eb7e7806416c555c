import 'server-only';
import { db } from '@/lib/db';
import type { GroupRole } from '@/lib/access';

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
