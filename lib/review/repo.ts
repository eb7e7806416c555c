import 'server-only';
import { enqueue } from '@/lib/outbox/repo';
import { db } from '@/lib/db';

// reviewer_links rows, and their uses as recorded in download_events (one row per view or download).

export type ReviewerLinkRow = {
  id: string;
  version_id: string;
  label: string;
  token_hash: string;
  anonymous: boolean;
  expires_at: Date;
  revoked_at: Date | null;
  last_used_at: Date | null;
  created_by: string | null;
  created_at: Date;
};

export type LinkWithUses = ReviewerLinkRow & { created_by_name: string | null; views: number; downloads: number };

export type LinkUseRow = { link_id: string; label: string; kind: 'investigation' | 'request'; created_at: Date; counted: boolean; is_robot: boolean };

function toRow(r: Record<string, unknown>): ReviewerLinkRow {
  return { ...(r as ReviewerLinkRow), anonymous: Boolean(r.anonymous) };
}

export async function insertReviewerLink(
  link: { id: string; versionId: string; label: string; tokenHash: string; anonymous: boolean; expiresAt: Date; createdBy: string; createdAt: Date },
): Promise<void> {
  await db()('reviewer_links').insert({
    id: link.id, version_id: link.versionId, label: link.label, token_hash: link.tokenHash, anonymous: link.anonymous,
    expires_at: link.expiresAt, created_by: link.createdBy, created_at: link.createdAt,
  });
}

/** The one indexed lookup a presented token costs (unique index on token_hash; the joins follow primary keys). */
export async function findLinkByTokenHash(tokenHash: string): Promise<(ReviewerLinkRow & { group_id: string }) | undefined> {
  const row = await db()('reviewer_links as l')
    .join('dataset_versions as v', 'v.id', 'l.version_id')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .where('l.token_hash', tokenHash)
    .first('l.*', 'd.group_id');
  return row ? { ...toRow(row), group_id: row.group_id } : undefined;
}

/** One link with its creator's name; ids that are not UUIDs are simply not found. */
export async function findLinkById(id: string): Promise<(ReviewerLinkRow & { created_by_name: string | null }) | undefined> {
  if (!/^[0-9a-f-]{36}$/i.test(id)) return undefined;
  const row = await db()('reviewer_links as l').leftJoin('users as u', 'u.id', 'l.created_by').where('l.id', id).first('l.*', 'u.name as created_by_name');
  return row ? { ...toRow(row), created_by_name: row.created_by_name ?? null } : undefined;
}

/** Sets revoked_at once; a second revoke keeps the first time. */
export async function markLinkRevoked(id: string, at: Date): Promise<void> {
  await db()('reviewer_links').where('id', id).whereNull('revoked_at').update({ revoked_at: at });
}

export async function touchLinkLastUsed(id: string, at: Date): Promise<void> {
  await db()('reviewer_links').where('id', id).update({ last_used_at: at });
}

/** Links of a version, newest first, with how often each was used to view and to download. */
export async function listLinksWithUses(versionId: string): Promise<LinkWithUses[]> {
  const uses = db()('download_events').whereNotNull('reviewer_link_id').groupBy('reviewer_link_id')
    .select('reviewer_link_id', db().raw("SUM(kind = 'investigation') AS views"), db().raw("SUM(kind = 'request') AS downloads"));
  const rows = await db()('reviewer_links as l')
    .leftJoin('users as u', 'u.id', 'l.created_by')
    .leftJoin(uses.as('e'), 'e.reviewer_link_id', 'l.id')
    .where('l.version_id', versionId)
    .orderBy([{ column: 'l.created_at', order: 'desc' }, { column: 'l.id', order: 'asc' }])
    .select('l.*', 'u.name as created_by_name', 'e.views', 'e.downloads');
  return rows.map((r: Record<string, unknown>) => ({
    ...toRow(r), created_by_name: (r.created_by_name as string | null) ?? null, views: Number(r.views ?? 0), downloads: Number(r.downloads ?? 0),
  }));
}

/** Every use of the version's links, newest first: when, what, through which link; never who. */
export async function listLinkUses(versionId: string, limit: number): Promise<LinkUseRow[]> {
  const rows = await db()('download_events as e')
    .join('reviewer_links as l', 'l.id', 'e.reviewer_link_id')
    .where('l.version_id', versionId)
    .orderBy([{ column: 'e.created_at', order: 'desc' }, { column: 'e.id', order: 'desc' }])
    .limit(limit)
    .select('l.id as link_id', 'l.label', 'e.kind', 'e.created_at', 'e.counted', 'e.is_robot');
  return rows.map((r: LinkUseRow) => ({ ...r, counted: Boolean(r.counted), is_robot: Boolean(r.is_robot) }));
}

/** Queues one reviewer mail (sealed payload); held briefly so the request can try it first. */
export async function enqueueReviewMail(topic: string, linkId: string, payload: unknown, holdMs: number): Promise<number> {
  return enqueue(db(), topic, linkId, payload, { holdMs });
}

/** After delivery the job keeps only what it was for: no address and no link survive in the outbox. */
export async function scrubReviewMailJob(outboxId: number, linkId: string): Promise<void> {
  await db()('outbox').where('id', outboxId).update({ payload: JSON.stringify({ linkId, delivered: true }) });
}
