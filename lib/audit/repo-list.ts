import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';

// Reading the audit log for its viewers: filters, paging, and the names of actors, groups and user targets.

export type AuditFilter = {
  groupId?: string;
  action?: string;
  actor?: { userId: string } | { email: string } | { nameContains: string };
  targetType?: string;
  targetId?: string;
  /** Inclusive lower and exclusive upper bound, UTC. */
  from?: Date;
  before?: Date;
};

export type AuditRow = {
  id: number | string; created_at: Date; action: string; actor_kind: string; actor_user_id: string | null; actor_name: string | null;
  actor_email: string | null; group_slug: string | null; group_name: string | null; target_type: string | null; target_id: string | null;
  target_user_name: string | null; details: unknown;
};

const likeEscaped = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

function filtered(f: AuditFilter): Knex.QueryBuilder {
  const q = db()('audit_log as l').leftJoin('users as a', 'a.id', 'l.actor_user_id');
  if (f.groupId) q.where('l.group_id', f.groupId);
  if (f.action) q.where('l.action', f.action);
  if (f.actor && 'userId' in f.actor) q.where('l.actor_user_id', f.actor.userId);
  if (f.actor && 'email' in f.actor) q.where('a.email', f.actor.email.toLowerCase());
  if (f.actor && 'nameContains' in f.actor) q.whereRaw('a.name LIKE ?', [likeEscaped(f.actor.nameContains)]);
  if (f.targetType) q.where('l.target_type', f.targetType);
  if (f.targetId) q.where('l.target_id', f.targetId);
  if (f.from) q.where('l.created_at', '>=', f.from);
  if (f.before) q.where('l.created_at', '<', f.before);
  return q;
}

export async function countAuditRows(f: AuditFilter): Promise<number> {
  const row = await filtered(f).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** Newest first; ties (same millisecond) by id. */
export async function listAuditRows(f: AuditFilter, offset: number, limit: number): Promise<AuditRow[]> {
  return filtered(f)
    .leftJoin('groups as g', 'g.id', 'l.group_id')
    .leftJoin('users as t', (j) => j.on('t.id', '=', 'l.target_id').andOnVal('l.target_type', '=', 'user'))
    .orderBy([{ column: 'l.created_at', order: 'desc' }, { column: 'l.id', order: 'desc' }])
    .offset(offset)
    .limit(limit)
    .select(
      'l.id', 'l.created_at', 'l.action', 'l.actor_kind', 'l.actor_user_id', 'a.name as actor_name', 'a.email as actor_email',
      'g.slug as group_slug', 'g.name as group_name', 'l.target_type', 'l.target_id', 't.name as target_user_name', 'l.details',
    );
}

/** The actions that occur in the scope, for the filter's choices. */
export async function listAuditActions(groupId?: string): Promise<string[]> {
  const q = db()('audit_log').distinct('action').orderBy('action');
  if (groupId) q.where('group_id', groupId);
  return q.pluck('action');
}
