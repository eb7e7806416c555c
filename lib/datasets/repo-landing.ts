import 'server-only';
import { db } from '@/lib/db';

// Reads for the public landing page: a dataset, all its versions, and the verified files of one version.

export type LandingDatasetRow = {
  dataset_id: string;
  concept_doi: string | null;
  group_id: string;
  group_slug: string;
  group_name: string;
  group_institution: string | null;
  group_ror_id: string | null;
};

export type LandingVersionRow = {
  id: string;
  dataset_id: string;
  version_number: number;
  state: 'draft' | 'in_review' | 'published' | 'withdrawn';
  title: string;
  metadata: unknown;
  doi: string | null;
  doi_state: 'none' | 'reserved' | 'pending' | 'registered' | 'findable';
  /** YYYY-MM-DD (UTC) or null. */
  embargo_until: string | null;
  requested_embargo_until: string | null;
  withdrawal_reason: string | null;
  submitted_at: Date | null;
  published_at: Date | null;
  withdrawn_at: Date | null;
  updated_at: Date;
};

export type LandingFileRow = {
  id: string;
  name: string;
  role: 'raw' | 'processed' | 'other';
  media_type: string | null;
  size_bytes: number;
  sha256: string | null;
  analysis_state: 'none' | 'queued' | 'running' | 'done' | 'failed';
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const parseJson = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);

/** True for a well-formed UUID; anything else is answered as not found without asking the database. */
export function isUuid(value: string): boolean {
  return UUID.test(value);
}

export async function findLandingDataset(datasetId: string): Promise<LandingDatasetRow | undefined> {
  if (!isUuid(datasetId)) return undefined;
  return db()('datasets as d')
    .join('groups as g', 'g.id', 'd.group_id')
    .where('d.id', datasetId)
    .first('d.id as dataset_id', 'd.concept_doi', 'g.id as group_id', 'g.slug as group_slug', 'g.name as group_name',
      'g.institution as group_institution', 'g.ror_id as group_ror_id');
}

export async function findDatasetIdOfVersion(versionId: string): Promise<string | undefined> {
  if (!isUuid(versionId)) return undefined;
  const row = await db()('dataset_versions').where('id', versionId).first('dataset_id');
  return row?.dataset_id;
}

/** Every version of the dataset, oldest first, metadata parsed. */
export async function listLandingVersions(datasetId: string): Promise<LandingVersionRow[]> {
  const rows = await db()('dataset_versions')
    .where('dataset_id', datasetId)
    .orderBy('version_number')
    .select(
      'id', 'dataset_id', 'version_number', 'state', 'title', 'metadata', 'doi', 'doi_state', 'withdrawal_reason',
      'submitted_at', 'published_at', 'withdrawn_at', 'updated_at',
      db().raw("DATE_FORMAT(embargo_until, '%Y-%m-%d') as embargo_until"),
      db().raw("DATE_FORMAT(requested_embargo_until, '%Y-%m-%d') as requested_embargo_until"),
    );
  return (rows as LandingVersionRow[]).map((r) => ({ ...r, version_number: Number(r.version_number), metadata: parseJson(r.metadata) }));
}

/** The version's verified files by name (pending or failed uploads are not part of a version's record). */
export async function listLandingFiles(versionId: string): Promise<LandingFileRow[]> {
  const rows = await db()('files')
    .where({ version_id: versionId, upload_state: 'verified' })
    .orderBy([{ column: 'name' }, { column: 'id' }])
    .select('id', 'name', 'role', 'media_type', 'size_bytes', 'sha256', 'analysis_state');
  return (rows as LandingFileRow[]).map((r) => ({ ...r, size_bytes: Number(r.size_bytes) }));
}

/** The stored analyses (FileSummary JSON) of the given files that finished, by file id. */
export async function listFileSummaries(fileIds: string[]): Promise<Map<string, unknown>> {
  if (fileIds.length === 0) return new Map();
  const rows: { id: string; analysis: unknown }[] = await db()('files')
    .whereIn('id', fileIds)
    .where('analysis_state', 'done')
    .whereNotNull('analysis')
    .select('id', 'analysis');
  return new Map(rows.map((r) => [r.id, parseJson(r.analysis)]));
}
