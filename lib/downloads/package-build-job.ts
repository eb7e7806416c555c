import 'server-only';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { log } from '@/lib/log';
import { JobAbandoned, JobInterrupted, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { DEFAULT_LEASE_MS, renewClaim, type OutboxRow } from '@/lib/outbox/repo';
import { defaultStore, objectExists, type ObjectStore } from '@/lib/storage/objects';
import { buildPackageIntoCache } from './build-cached-package';
import { loadPackageInput } from './load-package-input';
import { packageCacheKey } from './package-cache';
import { enqueuePackageBuildOnce, PACKAGE_BUILD_TOPIC, type PackageBuildPayload } from './repo-package-builds';

// The cached copy of a published package is built by the worker, apart from any download: the first download streams
// straight to its client and adds this job (download-package.ts); later downloads stream too until the copy exists,
// then get a presigned URL. A failed build is retried by the outbox and never touches a client's download.

export { PACKAGE_BUILD_TOPIC, type PackageBuildPayload } from './repo-package-builds';

/** How often a running build renews its claim; the outbox's lease (DEFAULT_LEASE_MS) is several times longer. */
const RENEW_EVERY_MS = 30_000;
/** A build waits at least this long after its first download, and at most MAX_HOLD_MS. */
const MIN_HOLD_MS = 30_000;
const MAX_HOLD_MS = 10 * 60_000;
/** The pace (bytes/s) assumed for the first download when deciding how long its build waits. */
const FIRST_DOWNLOAD_BYTES_PER_S = 100e6;

/**
 * How long workers leave a new build alone: about as long as the first download takes, so the two do not read the
 * same objects at once and halve each other's speed (30 s plus the payload at 100 MB/s, at most 10 minutes).
 */
export function buildHoldMs(payloadBytes: number): number {
  return Math.round(Math.min(MAX_HOLD_MS, MIN_HOLD_MS + (payloadBytes / FIRST_DOWNLOAD_BYTES_PER_S) * 1000));
}

/** Queues the build of a cached package once per cache key (see enqueuePackageBuildOnce). */
export async function queuePackageBuild(payload: PackageBuildPayload, payloadBytes: number): Promise<{ jobId: number; created: boolean }> {
  return enqueuePackageBuildOnce(payload, buildHoldMs(payloadBytes));
}

function parsePayload(payload: unknown): PackageBuildPayload {
  const p = (payload ?? {}) as Record<string, unknown>;
  const ok = typeof p.versionId === 'string' && typeof p.cacheKey === 'string' && (p.compression === 'store' || p.compression === 'deflate')
    && typeof p.baggingDate === 'string' && !Number.isNaN(Date.parse(p.baggingDate));
  // Retrying cannot mend a payload: close the job at once.
  if (!ok) throw new JobAbandoned(`${PACKAGE_BUILD_TOPIC} payload needs versionId, cacheKey, compression and baggingDate`);
  return p as PackageBuildPayload;
}

export type PackageBuildOptions = { store?: ObjectStore; signal?: AbortSignal };
export type PackageBuildResult = 'built' | 'already_cached' | 'not_published' | 'inputs_changed';

/**
 * Runs one build job: nothing to do when the copy exists already, when the version is no longer published, or when
 * its package would no longer be what the key stands for (a later download queues the new key). Otherwise builds
 * into the key, renewing the job's claim meanwhile so no other worker starts the same build. Rejects when the build
 * fails (the outbox retries it); the key then holds nothing.
 */
export async function runPackageBuild(payload: unknown, row: Pick<OutboxRow, 'id'>, options: PackageBuildOptions = {}): Promise<PackageBuildResult> {
  const job = parsePayload(payload);
  const store = options.store ?? defaultStore();
  if (await objectExists(store, job.cacheKey)) return 'already_cached';
  const version = await findVersionRow(job.versionId);
  if (!version || version.state !== 'published') {
    log('info', 'package build skipped: the version is not published', { jobId: row.id, versionId: job.versionId, state: version?.state ?? null });
    return 'not_published';
  }
  const input = { ...(await loadPackageInput({ version }, { kind: 'user', user: null }, new Date())), baggingDate: new Date(job.baggingDate) };
  if (packageCacheKey(version.id, input, job.compression) !== job.cacheKey) {
    log('info', 'package build skipped: the version\'s package changed since it was queued', { jobId: row.id, versionId: job.versionId, key: job.cacheKey });
    return 'inputs_changed';
  }
  const started = performance.now();
  const renew = setInterval(() => {
    renewClaim(row.id, DEFAULT_LEASE_MS).catch((error: unknown) => {
      log('warn', 'could not renew a package build\'s claim: another worker may start the same build when the claim runs out (harmless: the bytes are the same)', { jobId: row.id, error: error instanceof Error ? error.message : String(error) });
    });
  }, RENEW_EVERY_MS);
  try {
    const built = await buildPackageIntoCache({ input, store, key: job.cacheKey, compression: job.compression, signal: options.signal });
    log('info', 'package cached', { jobId: row.id, versionId: job.versionId, key: job.cacheKey, zipBytes: built.zipBytes, ms: Math.round(performance.now() - started) });
    return 'built';
  } finally {
    clearInterval(renew);
  }
}

/**
 * Tries of one build before it is given up: about 20 minutes with the outbox's backoff (10 s doubling, at most 10 min).
 * A cached copy only spares storage and CPU, so a build that keeps failing is closed rather than retried forever;
 * downloads stream meanwhile, and the next download queues a fresh build.
 */
export const MAX_BUILD_TRIES = 8;

/** The outbox handler of cache builds, run by scripts/worker.ts in a loop of its own (a build may take minutes). */
export function packageOutboxHandlers(options: PackageBuildOptions = {}): OutboxHandlers {
  return {
    [PACKAGE_BUILD_TOPIC]: async (payload, row) => {
      try {
        await runPackageBuild(payload, row, options);
      } catch (error) {
        // The worker stopping (a deploy, say) is no fault of the build: give the job back untried.
        if (options.signal?.aborted) throw new JobInterrupted('the worker stopped during the build', { cause: error });
        if (row.attempts < MAX_BUILD_TRIES || error instanceof JobAbandoned) throw error;
        const message = error instanceof Error ? error.message : String(error);
        throw new JobAbandoned(`given up after ${row.attempts} tries; the next download queues a new build. Last error: ${message}`);
      }
    },
  };
}
