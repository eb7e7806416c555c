import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';

export type AuditEntry = {
  action: string;
  actorKind: 'user' | 'reviewer' | 'token' | 'system' | 'anonymous';
  actorUserId?: string | null;
  groupId?: string | null;
  targetType?: string | null;
  targetId?: string | null;
  ipHash?: string | null;
  details?: Record<string, unknown> | null;
};

/** Writes one entry; pass a transaction so the entry commits (or not) with the change it records. */
export async function insertAudit(entry: AuditEntry, conn: Knex | Knex.Transaction = db()): Promise<void> {
  await conn('audit_log').insert({
    action: entry.action,
    actor_kind: entry.actorKind,
    actor_user_id: entry.actorUserId ?? null,
    group_id: entry.groupId ?? null,
    target_type: entry.targetType ?? null,
    target_id: entry.targetId ?? null,
    ip_hash: entry.ipHash ?? null,
    details: entry.details ? JSON.stringify(entry.details) : null,
  });
}

export async function listAudit(filter: { groupId?: string; action?: string; limit?: number }) {
  const q = db()('audit_log').orderBy('id', 'desc').limit(filter.limit ?? 100);
  if (filter.groupId) q.where({ group_id: filter.groupId });
  if (filter.action) q.where({ action: filter.action });
  return q;
}
