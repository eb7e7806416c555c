import { SEARCH_CHANGED_TOPIC } from './repo';

// The entry a publish or withdrawal adds to the outbox in its own transaction, so no app instance misses it:
// each instance's index follows these entries by id (lib/search/search-service.ts).

export function searchChangedJob(datasetId: string, versionId: string) {
  return { topic: SEARCH_CHANGED_TOPIC, aggregateId: datasetId, payload: { versionId } };
}

/** Outbox handler: the entry is a log for the indexes, so the worker only marks it seen. */
export function searchOutboxHandlers() {
  return { [SEARCH_CHANGED_TOPIC]: async () => undefined };
}
