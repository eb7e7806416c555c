import 'server-only';
import type { Knex } from 'knex';
import type { GroupRole } from '@/lib/access';
import { insertAudit, type AuditEntry } from '@/lib/audit/repo';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';

// Every change of a group's memberships runs here: one transaction that first locks the group row, so changes to
// one group happen one after another, and that refuses to commit a group without an owner.

export type LockedMember = { userId: string; role: GroupRole; name: string; email: string };
export type LockedGroup = { id: string; slug: string; name: string; members: LockedMember[] };

export type MembershipChange =
  | { kind: 'set_role'; userId: string; role: GroupRole }
  | { kind: 'remove'; userId: string }
  | { kind: 'add'; userId: string; role: GroupRole };

/** What one operation writes, decided from the group as locked. */
export type MembershipPlan<T> = { changes: MembershipChange[]; audit: AuditEntry[]; result: T };

export const LAST_OWNER_MESSAGE =
  'A group always needs at least one owner. Make another member an owner first (or transfer ownership), then try again.';

/** Locks the group row (FOR UPDATE) and reads its members with locking reads, which see the latest committed rows. */
export async function lockGroup(trx: Knex.Transaction, groupId: string): Promise<LockedGroup | undefined> {
  const group = await trx('groups').where({ id: groupId }).forUpdate().first('id', 'slug', 'name');
  if (!group) return undefined;
  const rows: { user_id: string; role: GroupRole }[] = await trx('memberships').where({ group_id: groupId }).forUpdate().select('user_id', 'role');
  const users: { id: string; name: string; email: string }[] = rows.length
    ? await trx('users').whereIn('id', rows.map((r) => r.user_id)).select('id', 'name', 'email')
    : [];
  const byId = new Map(users.map((u) => [u.id, u]));
  const members = rows.map((r) => ({ userId: r.user_id, role: r.role, name: byId.get(r.user_id)?.name ?? '', email: byId.get(r.user_id)?.email ?? '' }));
  return { ...group, members };
}

/** Applies the changes, then counts owners again under the lock: zero owners rolls the whole transaction back. */
export async function applyMembershipChanges(trx: Knex.Transaction, groupId: string, changes: MembershipChange[]): Promise<void> {
  for (const c of changes) {
    const key = { group_id: groupId, user_id: c.userId };
    if (c.kind === 'set_role') await trx('memberships').where(key).update({ role: c.role });
    else if (c.kind === 'remove') await trx('memberships').where(key).delete();
    else await trx('memberships').insert({ ...key, role: c.role });
  }
  const owners = await trx('memberships').where({ group_id: groupId, role: 'owner' }).forUpdate().select('user_id');
  if (owners.length === 0) throw new AppError('conflict', LAST_OWNER_MESSAGE, { reason: 'last_owner' });
}

/**
 * One membership operation: lock, let `plan` decide from what it sees (it throws to refuse, and nothing is
 * written), apply, check the owner invariant, write the audit entries, commit.
 */
export async function runMembershipPlan<T>(groupId: string, plan: (group: LockedGroup) => MembershipPlan<T>): Promise<T> {
  return db().transaction(async (trx) => {
    const group = await lockGroup(trx, groupId);
    if (!group) throw new AppError('not_found', 'We could not find this group.');
    const p = plan(group);
    if (p.changes.length > 0) await applyMembershipChanges(trx, groupId, p.changes);
    for (const entry of p.audit) await insertAudit(entry, trx);
    return p.result;
  });
}

/** Members with their e-mail addresses and when they joined, owners first. */
export async function listMembersWithJoined(groupId: string): Promise<(LockedMember & { joinedAt: Date; orcid: string | null })[]> {
  const rows: { user_id: string; role: GroupRole; name: string; email: string; orcid: string | null; created_at: Date }[] = await db()('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.group_id', groupId)
    .orderByRaw("FIELD(m.role, 'owner', 'curator', 'member'), u.name")
    .select('m.user_id', 'm.role', 'u.name', 'u.email', 'u.orcid', 'm.created_at');
  return rows.map((r) => ({ userId: r.user_id, role: r.role, name: r.name, email: r.email, orcid: r.orcid, joinedAt: r.created_at }));
}
