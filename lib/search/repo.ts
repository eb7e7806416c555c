import 'server-only';
import { db } from '@/lib/db';
import type { TransportDatasetDraft } from '@/lib/schema';
import type { FileSummary } from '@/lib/transport/summary/types';
import type { PublishedVersionSource } from './build-search-doc';

// Reads for the search index: published versions (embargoed ones included; drafts, reviews and withdrawn never),
// and the 'search.changed' log in the outbox that every app instance follows.

export const SEARCH_CHANGED_TOPIC = 'search.changed';

const parse = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

/** Published versions, all or of some datasets, with their analysed files; isLatest = newest published of the dataset. */
export async function loadPublishedSources(datasetIds?: readonly string[]): Promise<PublishedVersionSource[]> {
  const q = db()('dataset_versions as v')
    .join('datasets as d', 'd.id', 'v.dataset_id')
    .join('groups as g', 'g.id', 'd.group_id')
    .where('v.state', 'published')
    .select('v.id', 'v.dataset_id', 'v.version_number', 'v.title', 'v.metadata', 'v.published_at', 'v.doi',
      db().raw("DATE_FORMAT(v.embargo_until, '%Y-%m-%d') as embargo_until"), 'g.slug as group_slug', 'g.name as group_name',
      db().raw(`v.version_number = (SELECT MAX(v2.version_number) FROM dataset_versions v2
        WHERE v2.dataset_id = v.dataset_id AND v2.state = 'published') AS is_latest`));
  if (datasetIds) q.whereIn('v.dataset_id', datasetIds.length ? [...datasetIds] : ['']);
  const rows = await q;
  const ids = rows.map((r) => r.id as string);
  const summaries = new Map<string, FileSummary[]>();
  for (let i = 0; i < ids.length; i += 1000) {
    const files = await db()('files').whereIn('version_id', ids.slice(i, i + 1000)).where({ upload_state: 'verified', analysis_state: 'done' })
      .orderBy('name').select('version_id', 'analysis');
    for (const f of files) {
      const list = summaries.get(f.version_id) ?? [];
      list.push(parse<FileSummary>(f.analysis));
      summaries.set(f.version_id, list);
    }
  }
  return rows.map((r) => ({
    versionId: r.id, datasetId: r.dataset_id, versionNumber: r.version_number, isLatest: Boolean(Number(r.is_latest)),
    title: r.title, record: parse<TransportDatasetDraft>(r.metadata), group: { slug: r.group_slug, name: r.group_name },
    publishedAt: r.published_at ?? new Date(0), embargoUntil: r.embargo_until, doi: r.doi, summaries: summaries.get(r.id) ?? [],
  }));
}

/** The newest id of the change log, read before a rebuild so that changes during it are replayed afterwards. */
export async function latestSearchChangeId(): Promise<number> {
  const row = await db()('outbox').where('topic', SEARCH_CHANGED_TOPIC).max({ id: 'id' }).first();
  return Number(row?.id ?? 0);
}

/** Datasets changed after `afterId` (in order), and the id to continue from. */
export async function searchChangesSince(afterId: number, limit = 500): Promise<{ datasetIds: string[]; lastId: number; rebuild: boolean }> {
  const rows: { id: number; aggregate_id: string; payload: unknown }[] = await db()('outbox')
    .where('topic', SEARCH_CHANGED_TOPIC).where('id', '>', afterId).orderBy('id').limit(limit).select('id', 'aggregate_id', 'payload');
  const rebuild = rows.some((r) => parse<{ rebuild?: boolean }>(r.payload)?.rebuild === true);
  return { datasetIds: [...new Set(rows.map((r) => r.aggregate_id))], lastId: rows.length ? Number(rows.at(-1)!.id) : afterId, rebuild };
}
