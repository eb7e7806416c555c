import 'server-only';
import { db } from '@/lib/db';

export type PublishedCard = {
  version_id: string; dataset_id: string; title: string; version_number: number; doi: string | null;
  published_at: Date | null; embargo_until: string | null; group_name: string; group_slug: string;
};

/** The newest published versions, for the home page (the search index replaces this for queries). */
export async function listRecentPublished(limit = 6, titleContains?: string): Promise<PublishedCard[]> {
  const q = db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .join('groups as g', 'g.id', 'd.group_id')
    .where('v.state', 'published')
    .orderBy('v.published_at', 'desc')
    .limit(limit)
    .select('v.id as version_id', 'd.id as dataset_id', 'v.title', 'v.version_number', 'v.doi', 'v.published_at',
      db().raw("DATE_FORMAT(v.embargo_until, '%Y-%m-%d') as embargo_until"), 'g.name as group_name', 'g.slug as group_slug');
  if (titleContains) q.whereRaw('v.title LIKE ?', [`%${titleContains.replace(/[\\%_]/g, (c) => `\\${c}`)}%`]);
  return q;
}

export async function countDatasetsByState(): Promise<Record<string, number>> {
  const rows: { state: string; n: number }[] = await db()('dataset_versions').select('state').count({ n: '*' }).groupBy('state');
  return Object.fromEntries(rows.map((r) => [r.state, Number(r.n)]));
}
