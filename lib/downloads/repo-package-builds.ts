import 'server-only';
import { db } from '@/lib/db';
import { enqueue } from '@/lib/outbox/repo';

// Cache builds of packages are outbox jobs (topic below, aggregate: the version). At most one job per cache key waits
// at a time; the worker that claims one keeps its claim while the build runs.

export const PACKAGE_BUILD_TOPIC = 'package.build';

/** What a build job carries: the version and the cache key its package goes to, and how the first download built it. */
export type PackageBuildPayload = {
  versionId: string;
  cacheKey: string;
  compression: 'store' | 'deflate';
  /** The first download's Bagging-Date and zip entry time, so the cached copy holds the very bytes that client got. */
  baggingDate: string;
};

const parse = (payload: unknown): Partial<PackageBuildPayload> =>
  (typeof payload === 'string' ? JSON.parse(payload) : (payload ?? {})) as Partial<PackageBuildPayload>;

/**
 * Adds a build job for `payload.cacheKey` unless one is already waiting (not yet processed) for that key. The version's
 * row is locked for the check, so two first downloads at once add one job between them. `holdMs` keeps workers off
 * the new job for a while (see package-build-job.ts). created: false when the waiting job was found.
 */
export async function enqueuePackageBuildOnce(payload: PackageBuildPayload, holdMs: number): Promise<{ jobId: number; created: boolean }> {
  return db().transaction(async (trx) => {
    await trx('dataset_versions').where('id', payload.versionId).forUpdate().first('id');
    const waiting: { id: number | string; payload: unknown }[] = await trx('outbox')
      .where({ topic: PACKAGE_BUILD_TOPIC, aggregate_id: payload.versionId }).whereNull('processed_at').orderBy('id').select('id', 'payload');
    const same = waiting.find((row) => parse(row.payload).cacheKey === payload.cacheKey);
    if (same) return { jobId: Number(same.id), created: false };
    return { jobId: await enqueue(trx, PACKAGE_BUILD_TOPIC, payload.versionId, payload, { holdMs }), created: true };
  });
}
