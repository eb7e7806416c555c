import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';
import { enqueue } from '@/lib/outbox/repo';
import type { OutboxJobSpec } from './repo-transitions';

/** A version of a dataset as the DOI records need it. */
export type RegistrationVersionRow = {
  id: string; dataset_id: string; version_number: number; state: 'draft' | 'in_review' | 'published' | 'withdrawn';
  title: string; metadata: unknown; doi: string | null; doi_state: string;
  published_at: Date | null; withdrawn_at: Date | null; withdrawal_reason: string | null;
  /** YYYY-MM-DD or null. */
  embargo_until: string | null;
  requested_embargo_until: string | null;
};

export type DatasetRegistrationRows = {
  datasetId: string; conceptDoi: string | null; group: { name: string; rorId: string | null };
  /** Every version of the dataset, oldest first. */
  versions: RegistrationVersionRow[];
};

export type PublishedFileRow = { name: string; size_bytes: number; media_type: string | null; sha256: string | null };

const parseJson = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

export async function datasetIdOfVersion(versionId: string): Promise<string | undefined> {
  const row = await db()('dataset_versions').where('id', versionId).first('dataset_id');
  return row?.dataset_id;
}

/** The dataset, its group and all its versions (for DOI records and version relations). */
export async function loadDatasetRegistrationRows(datasetId: string): Promise<DatasetRegistrationRows | undefined> {
  const dataset = await db()('datasets as d').join('groups as g', 'g.id', 'd.group_id').where('d.id', datasetId)
    .first('d.id', 'd.concept_doi', 'g.name as group_name', 'g.ror_id as group_ror_id');
  if (!dataset) return undefined;
  const rows: RegistrationVersionRow[] = await db()('dataset_versions').where('dataset_id', datasetId).orderBy('version_number')
    .select(
      'id', 'dataset_id', 'version_number', 'state', 'title', 'metadata', 'doi', 'doi_state', 'published_at', 'withdrawn_at', 'withdrawal_reason',
      db().raw("DATE_FORMAT(embargo_until, '%Y-%m-%d') as embargo_until"),
      db().raw("DATE_FORMAT(requested_embargo_until, '%Y-%m-%d') as requested_embargo_until"),
    );
  return {
    datasetId, conceptDoi: dataset.concept_doi, group: { name: dataset.group_name, rorId: dataset.group_ror_id },
    versions: rows.map((r) => ({ ...r, metadata: parseJson(r.metadata) })),
  };
}

/** The files a version publishes: verified ones only (pending uploads are not part of it). */
export async function listPublishedFiles(versionId: string): Promise<PublishedFileRow[]> {
  const rows: PublishedFileRow[] = await db()('files').where({ version_id: versionId, upload_state: 'verified' })
    .orderBy([{ column: 'name' }]).select('name', 'size_bytes', 'media_type', 'sha256');
  return rows.map((r) => ({ ...r, size_bytes: Number(r.size_bytes) }));
}

/** Names of the version's uploads that have not finished (they block submission and publication). */
export async function listUnfinishedUploads(versionId: string): Promise<string[]> {
  const rows: { name: string }[] = await db()('files').where('version_id', versionId).whereNot('upload_state', 'verified').orderBy('name').select('name');
  return rows.map((r) => r.name);
}

/** Records what the agency now holds, unless the version moved to another state meanwhile (its own job follows). */
export async function setDoiState(versionId: string, whileState: string, doiState: 'findable' | 'registered'): Promise<boolean> {
  return (await db()('dataset_versions').where({ id: versionId, state: whileState }).update({ doi_state: doiState })) === 1;
}

/**
 * Once-only notice: sets `column` where it is still null and `where` holds, and enqueues the mails in the same
 * transaction. True when this call won (exactly one caller does, however many race).
 */
async function claimNotice(
  versionId: string,
  column: 'published_notice_sent_at' | 'embargo_notice_sent_at',
  where: (q: Knex.QueryBuilder) => Knex.QueryBuilder,
  jobs: OutboxJobSpec[],
): Promise<boolean> {
  return db().transaction(async (trx) => {
    const changed = await where(trx('dataset_versions').where('id', versionId).whereNull(column)).update({ [column]: new Date() });
    if (changed !== 1) return false;
    for (const j of jobs) await enqueue(trx, j.topic, j.aggregateId, j.payload, { holdMs: j.holdMs });
    return true;
  });
}

export function claimPublishedNotice(versionId: string, jobs: OutboxJobSpec[]): Promise<boolean> {
  return claimNotice(versionId, 'published_notice_sent_at', (q) => q.where('state', 'published'), jobs);
}

/** Only while the version is published and its embargo day (UTC) has begun by `today` (YYYY-MM-DD). */
export function claimEmbargoNotice(versionId: string, today: string, jobs: OutboxJobSpec[]): Promise<boolean> {
  return claimNotice(versionId, 'embargo_notice_sent_at', (q) => q.where('state', 'published').whereNotNull('embargo_until').where('embargo_until', '<=', today), jobs);
}

export type EmbargoNoticeState = { state: string; embargo_until: string | null; embargo_notice_sent_at: Date | null };

export async function findEmbargoNoticeState(versionId: string): Promise<EmbargoNoticeState | undefined> {
  return db()('dataset_versions').where('id', versionId)
    .first('state', db().raw("DATE_FORMAT(embargo_until, '%Y-%m-%d') as embargo_until"), 'embargo_notice_sent_at');
}

/** Published versions whose embargo ended by `today` and whose authors were not told yet, oldest first. */
export async function listDueEmbargoNotices(today: string, limit: number): Promise<string[]> {
  const rows: { id: string }[] = await db()('dataset_versions')
    .where('state', 'published').whereNotNull('embargo_until').where('embargo_until', '<=', today).whereNull('embargo_notice_sent_at')
    .orderBy('embargo_until').limit(limit).select('id');
  return rows.map((r) => r.id);
}
