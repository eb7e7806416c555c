import { SEARCH_CHANGED_TOPIC } from './repo';

// The entry a publish or withdrawal adds to the outbox in its own transaction, so no app instance misses it:
// each instance's index follows these entries by id (lib/search/search-service.ts).

export function searchChangedJob(datasetId: string, versionId: string) {
  return { topic: SEARCH_CHANGED_TOPIC, aggregateId: datasetId, payload: { versionId } };
}

const counter = globalThis as unknown as { ohmsteadSearchLocalChanges?: number };

/**
 * Called once a transaction holding a searchChangedJob has committed in this process: this instance's index then
 * reads the log before its next search instead of within its catch-up interval (search-service.ts).
 */
export function searchChangeCommitted(): void {
  counter.ohmsteadSearchLocalChanges = localSearchChanges() + 1;
}

/** How many search changes this process has committed (compared, never interpreted). */
export function localSearchChanges(): number {
  return counter.ohmsteadSearchLocalChanges ?? 0;
}

/** Outbox handler: the entry is a log for the indexes, so the worker only marks it seen. */
export function searchOutboxHandlers() {
  return { [SEARCH_CHANGED_TOPIC]: async () => undefined };
}
