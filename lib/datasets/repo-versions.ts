import 'server-only';
import { db } from '@/lib/db';

/** One dataset version joined with its dataset and group (the shape every version route starts from). */
export type VersionRow = {
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
  review_comment: string | null;
  withdrawal_reason: string | null;
  submitted_at: Date | null;
  published_at: Date | null;
  withdrawn_at: Date | null;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
  group_id: string;
  group_slug: string;
  group_name: string;
  concept_doi: string | null;
};

function parseJson(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value;
}

export async function findVersionRow(versionId: string): Promise<VersionRow | undefined> {
  const row = await db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .join('groups as g', 'g.id', 'd.group_id')
    .where('v.id', versionId)
    .first(
      'v.*',
      db().raw("DATE_FORMAT(v.embargo_until, '%Y-%m-%d') as embargo_until"),
      'd.group_id', 'd.concept_doi', 'g.slug as group_slug', 'g.name as group_name',
    );
  return row ? { ...row, metadata: parseJson(row.metadata) } : undefined;
}

/** False when the dataset has a version with a higher number. */
export async function isLatestVersion(version: Pick<VersionRow, 'dataset_id' | 'version_number'>): Promise<boolean> {
  const newer = await db()('dataset_versions').where('dataset_id', version.dataset_id).where('version_number', '>', version.version_number).first('id');
  return !newer;
}
