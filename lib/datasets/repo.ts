import 'server-only';
import { db } from '@/lib/db';
import { enqueue } from '@/lib/outbox/repo';

export type PublishedCard = {
  version_id: string; dataset_id: string; title: string; version_number: number; doi: string | null;
  published_at: Date | null; embargo_until: string | null; group_name: string; group_slug: string;
};

/**
 * The newest published versions, for the home page (the search index replaces this for queries). The newest `limit`
 * are picked from dataset_versions alone, in (state, published_at) index order, before the joins: joined first,
 * MariaDB 10.11 reads the tiny groups table through a join buffer, which loses the index order and sorts every
 * published version (16 s at 100k versions in bench/load-fixture.ts, against 40 ms this way).
 */
export async function listRecentPublished(limit = 6, titleContains?: string): Promise<PublishedCard[]> {
  const newest = db()('dataset_versions')
    .where('state', 'published')
    .orderBy([{ column: 'published_at', order: 'desc' }, { column: 'id', order: 'desc' }])
    .limit(limit)
    .select('id', 'dataset_id', 'title', 'version_number', 'doi', 'published_at', 'embargo_until');
  if (titleContains) newest.whereRaw('title LIKE ?', [`%${titleContains.replace(/[\\%_]/g, (c) => `\\${c}`)}%`]);
  return db()
    .from(newest.as('v'))
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .join('groups as g', 'g.id', 'd.group_id')
    .orderBy([{ column: 'v.published_at', order: 'desc' }, { column: 'v.id', order: 'desc' }])
    .select('v.id as version_id', 'd.id as dataset_id', 'v.title', 'v.version_number', 'v.doi', 'v.published_at',
      db().raw("DATE_FORMAT(v.embargo_until, '%Y-%m-%d') as embargo_until"), 'g.name as group_name', 'g.slug as group_slug');
}

export async function countDatasetsByState(): Promise<Record<string, number>> {
  const rows: { state: string; n: number }[] = await db()('dataset_versions').select('state').count({ n: '*' }).groupBy('state');
  return Object.fromEntries(rows.map((r) => [r.state, Number(r.n)]));
}

// ——— Deposit: creating drafts and saving their metadata ———

export type NewDraftDataset = {
  datasetId: string; versionId: string; groupId: string; userId: string; title: string; metadata: unknown; doi: string; conceptDoi: string;
};

/**
 * One transaction: the dataset, its draft version 1, the 'doi.reserve' outbox job (held `holdMs` for the
 * caller's own first try) and the audit entry. Returns the outbox job's id.
 */
export async function insertDraftDataset(d: NewDraftDataset, options: { holdMs: number }): Promise<number> {
  return db().transaction(async (trx) => {
    await trx('datasets').insert({ id: d.datasetId, group_id: d.groupId, concept_doi: d.conceptDoi, created_by: d.userId });
    await trx('dataset_versions').insert({
      id: d.versionId, dataset_id: d.datasetId, version_number: 1, state: 'draft', title: d.title,
      metadata: JSON.stringify(d.metadata), doi: d.doi, doi_state: 'none', created_by: d.userId,
    });
    const outboxId = await enqueue(trx, 'doi.reserve', d.versionId, { versionId: d.versionId }, { holdMs: options.holdMs });
    // Same columns as lib/audit's insertAudit, written here so the entry commits (or not) with the dataset.
    await trx('audit_log').insert({
      action: 'dataset.create', actor_kind: 'user', actor_user_id: d.userId, group_id: d.groupId, target_type: 'dataset',
      target_id: d.datasetId, details: JSON.stringify({ versionId: d.versionId, title: d.title, doi: d.doi, conceptDoi: d.conceptDoi }),
    });
    return outboxId;
  });
}

/** 'none' → 'reserved' once both draft DOIs exist at the agency; later states are never set back. */
export async function markDoiReserved(versionId: string): Promise<void> {
  await db()('dataset_versions').where({ id: versionId, doi_state: 'none' }).update({ doi_state: 'reserved' });
}

/** Stores a draft's metadata (and title when given); 0 when the version is no longer a draft. */
export async function updateDraftMetadata(versionId: string, metadataJson: string, title: string | null): Promise<number> {
  return db()('dataset_versions')
    .where({ id: versionId, state: 'draft' })
    .update({ metadata: metadataJson, ...(title !== null ? { title } : {}), updated_at: new Date() });
}

export type DraftListRow = {
  version_id: string; dataset_id: string; title: string; version_number: number; group_slug: string; group_name: string;
  updated_at: Date; file_count: number | string;
};

/** Draft versions in every group the user belongs to, most recently changed first. */
export async function listDraftRowsForMember(userId: string): Promise<DraftListRow[]> {
  return db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .join('groups as g', 'g.id', 'd.group_id')
    .join('memberships as m', (j) => j.on('m.group_id', '=', 'g.id').andOnVal('m.user_id', '=', userId))
    .where('v.state', 'draft')
    .orderBy([{ column: 'v.updated_at', order: 'desc' }, { column: 'v.created_at', order: 'desc' }, { column: 'v.id', order: 'asc' }])
    .select('v.id as version_id', 'v.dataset_id', 'v.title', 'v.version_number', 'g.slug as group_slug', 'g.name as group_name', 'v.updated_at')
    .select(db().raw("(SELECT COUNT(*) FROM files f WHERE f.version_id = v.id AND f.upload_state = 'verified') AS file_count"));
}
