import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';

export type ClaimedFile = { id: string; versionId: string; name: string; sizeBytes: number; storageKey: string; metadata: unknown };

const parseJson = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);

/**
 * Claims one file to analyse: queued, or running but silent since `staleBefore` (its worker died). The UPDATE
 * re-checks the state, so of several workers exactly one wins each file.
 */
export async function claimNextAnalysis(opts: { fileIds?: string[]; staleBefore: Date }): Promise<ClaimedFile | undefined> {
  const claimable = (q: Knex.QueryBuilder, alias = '') =>
    q.where((w) =>
      w.where(`${alias}analysis_state`, 'queued').orWhere((r) => r.where(`${alias}analysis_state`, 'running').where(`${alias}updated_at`, '<', opts.staleBefore)),
    );
  if (opts.fileIds && opts.fileIds.length === 0) return undefined;
  const candidates: { id: string }[] = await claimable(db()('files as f'), 'f.')
    .where('f.upload_state', 'verified')
    .modify((q) => (opts.fileIds ? q.whereIn('f.id', opts.fileIds) : q))
    .orderBy('f.updated_at')
    .limit(5)
    .select('f.id');
  for (const { id } of candidates) {
    const won = await claimable(db()('files').where({ id, upload_state: 'verified' })).update({
      analysis_state: 'running', analysis_progress: 0, updated_at: db().fn.now(),
    });
    if (won !== 1) continue;
    const row = await db()('files as f')
      .join('blobs as b', 'b.sha256', 'f.sha256')
      .join('dataset_versions as v', 'v.id', 'f.version_id')
      .where('f.id', id)
      .first('f.id', 'f.version_id', 'f.name', 'f.size_bytes', 'b.storage_key', 'v.metadata');
    if (!row) continue;
    return { id: row.id, versionId: row.version_id, name: row.name, sizeBytes: Number(row.size_bytes), storageKey: row.storage_key, metadata: parseJson(row.metadata) };
  }
  return undefined;
}

/** Progress 0..1 of a running analysis; also shows the worker is alive (updated_at). */
export async function setAnalysisProgress(fileId: string, progress: number): Promise<void> {
  await db()('files').where({ id: fileId, analysis_state: 'running' }).update({ analysis_progress: progress, updated_at: db().fn.now() });
}

/** Stores the summary; false when the file was requeued or removed meanwhile (the result is then stale). */
export async function finishAnalysis(fileId: string, summary: unknown): Promise<boolean> {
  const n = await db()('files').where({ id: fileId, analysis_state: 'running' }).update({
    analysis_state: 'done', analysis_progress: 1, analysis: JSON.stringify(summary), analysis_error: null, updated_at: db().fn.now(),
  });
  return n === 1;
}

export async function failAnalysis(fileId: string, message: string): Promise<boolean> {
  const n = await db()('files').where({ id: fileId, analysis_state: 'running' }).update({
    analysis_state: 'failed', analysis: null, analysis_error: message, updated_at: db().fn.now(),
  });
  return n === 1;
}

/** Puts a running file back in the queue (the worker is stopping, or storage is down for now). */
export async function releaseAnalysis(fileId: string): Promise<void> {
  await db()('files').where({ id: fileId, analysis_state: 'running' }).update({ analysis_state: 'queued', analysis_progress: 0, updated_at: db().fn.now() });
}

/** Queues the version's verified analysable files again (their last summary stays readable until the new one). */
export async function requeueVersionFiles(versionId: string): Promise<number> {
  return db()('files')
    .where({ version_id: versionId, upload_state: 'verified' })
    .whereNot({ analysis_state: 'none' })
    .update({ analysis_state: 'queued', analysis_progress: 0, analysis_error: null, updated_at: db().fn.now() });
}

export type AnalysisRow = { state: 'none' | 'queued' | 'running' | 'done' | 'failed'; progress: number; error: string | null; summary: unknown };

export async function findAnalysis(fileId: string): Promise<AnalysisRow | undefined> {
  const row = await db()('files').where({ id: fileId }).first('analysis_state', 'analysis_progress', 'analysis_error', 'analysis');
  if (!row) return undefined;
  return { state: row.analysis_state, progress: Number(row.analysis_progress), error: row.analysis_error, summary: row.analysis ? parseJson(row.analysis) : null };
}
