import { SEARCH_CHANGED_TOPIC } from './repo';

// The entry a publish or withdrawal adds to the outbox in its own transaction, so no app instance misses it:
// each instance's index follows these entries by id (lib/search/search-service.ts).

export function searchChangedJob(datasetId: string, versionId: string) {
  return { topic: SEARCH_CHANGED_TOPIC, aggregateId: datasetId, payload: { versionId } };
}

const counter = globalThis as unknown as { ohmsteadSearchLocalChanges?: number };

/**
 * Called with the outbox jobs of a transaction this process has just committed: when one is a searchChangedJob, this
 * instance's index reads the log before its next search instead of within its catch-up interval (search-service.ts).
 */
export function noteCommittedJobs(jobs: readonly { topic: string }[]): void {
  if (jobs.some((job) => job.topic === SEARCH_CHANGED_TOPIC)) counter.ohmsteadSearchLocalChanges = localSearchChanges() + 1;
}

/** How many search changes this process has committed (compared, never interpreted). */
export function localSearchChanges(): number {
  return counter.ohmsteadSearchLocalChanges ?? 0;
}

/** Outbox handler: the entry is a log for the indexes, so the worker only marks it seen. */
export function searchOutboxHandlers() {
  return { [SEARCH_CHANGED_TOPIC]: async () => undefined };
}
