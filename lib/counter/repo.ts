import 'server-only';
import { db } from '@/lib/db';
import type { UsageRow } from './usage-totals';

// download_events: one row per view or download, with its session hash and whether COUNTER counts it.

export type UsageKind = 'investigation' | 'request';

export type UsageEventRow = {
  versionId: string; fileId: string | null; kind: UsageKind; userId: string | null; reviewerLinkId: string | null;
  sessionHash: string; isRobot: boolean; counted: boolean; at: Date;
};

/** The last counted human use of the item by any of these sessions in [since, until] (index session_hash, version_id, created_at). */
export async function lastCountedUse(q: {
  sessionHashes: string[]; versionId: string; kind: UsageKind; fileId: string | null; since: Date; until: Date;
}): Promise<Date | null> {
  const query = db()('download_events')
    .whereIn('session_hash', q.sessionHashes).where({ version_id: q.versionId, kind: q.kind, counted: true, is_robot: false })
    .whereBetween('created_at', [q.since, q.until]);
  if (q.fileId) query.where('file_id', q.fileId);
  else query.whereNull('file_id');
  const row = await query.max('created_at as at').first();
  return row?.at ? new Date(row.at) : null;
}

export async function insertUsageEvent(e: UsageEventRow): Promise<number> {
  const [id] = await db()('download_events').insert({
    version_id: e.versionId, file_id: e.fileId, kind: e.kind, user_id: e.userId, reviewer_link_id: e.reviewerLinkId,
    session_hash: e.sessionHash, is_robot: e.isRobot, counted: e.counted, created_at: e.at,
  });
  return Number(id);
}

/** Counted, non-robot events; investigations include requests (see usage-totals.ts). */
const METRICS = [
  'COUNT(*) AS inv_total',
  'COUNT(DISTINCT e.session_hash) AS inv_unique',
  "SUM(e.kind = 'request') AS req_total",
  "COUNT(DISTINCT CASE WHEN e.kind = 'request' THEN e.session_hash END) AS req_unique",
].join(', ');

export async function versionUsageRow(versionId: string): Promise<UsageRow | undefined> {
  return db()('download_events as e').where({ 'e.version_id': versionId, 'e.counted': true, 'e.is_robot': false }).first(db().raw(METRICS));
}

export type GroupUsageRow = UsageRow & { version_id: string; dataset_id: string; version_number: number; title: string; state: string };

/** Per version of the group's datasets, only versions that were used in [from, to). */
export async function groupUsageRows(groupId: string, from: Date | null, to: Date | null): Promise<GroupUsageRow[]> {
  const q = db()('download_events as e')
    .join('dataset_versions as v', 'v.id', 'e.version_id')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .where({ 'd.group_id': groupId, 'e.counted': true, 'e.is_robot': false })
    .groupBy('e.version_id', 'v.dataset_id', 'v.version_number', 'v.title', 'v.state')
    .orderBy([{ column: 'v.title' }, { column: 'v.version_number' }])
    .select('e.version_id', 'v.dataset_id', 'v.version_number', 'v.title', 'v.state', db().raw(METRICS));
  if (from) q.where('e.created_at', '>=', from);
  if (to) q.where('e.created_at', '<', to);
  return q;
}
