import 'server-only';
import { log } from '@/lib/log';
import { buildSearchDoc, type PublishedVersionSource } from './build-search-doc';
import { startKeyWorker } from './key-worker';
import { latestSearchChangeId, loadPublishedSources, searchChangesSince } from './repo';
import { localSearchChanges } from './search-changed';
import { SearchIndex } from './search-index';
import type { SearchDoc, SearchQuery, SearchResult } from './types';

// One index per app instance: built from the database on first use, then kept current by following the
// 'search.changed' log in the outbox (every instance reads every entry; none consumes it for the others).
// The log is read at most once per CATCH_UP_INTERVAL_MS rather than on every search: a change committed by another
// instance shows here within that interval (1 s, as a search engine's usual refresh interval), while one committed by
// this instance is caught up before the next search (noteCommittedJobs in search-changed.ts).
export const CATCH_UP_INTERVAL_MS = 1000;

/** `byDataset` remembers which versions each dataset has in the index, to drop withdrawn or superseded ones. */
type State = {
  index: SearchIndex; cursor: number; builtAt: Date; byDataset: Map<string, Set<string>>;
  /** When the last complete catch-up started (performance.now()), and the local change count it had seen. */
  caughtUpAt: number; localSeen: number;
};

const holder = globalThis as unknown as {
  ohmsteadSearch?: Promise<State>; ohmsteadSearchCatchUp?: Promise<void>;
  /** The built state once the build has finished (read by searchIndexHealth, which must not wait for it). */
  ohmsteadSearchReady?: State;
  /** Why the last build failed, until one succeeds. */
  ohmsteadSearchFailure?: string;
};

function docsOf(sources: PublishedVersionSource[]) {
  const docs = [];
  for (const s of sources) {
    try {
      docs.push(buildSearchDoc(s));
    } catch (error) {
      log('warn', 'search: version left out of the index', { versionId: s.versionId, error: error instanceof Error ? error.message : String(error) });
    }
  }
  return docs;
}

async function build(): Promise<State> {
  const started = Date.now();
  const startedAt = performance.now();
  const localSeen = localSearchChanges();
  const cursor = await latestSearchChangeId(); // read first: a change committed during the load is replayed after
  const sources = await loadPublishedSources();
  const state: State = {
    index: new SearchIndex({ capacity: sources.length }), cursor, builtAt: new Date(), byDataset: new Map(), caughtUpAt: startedAt, localSeen,
  };
  const docs = docsOf(sources);
  // Keys are numbered on a worker thread while this one fills the index (both cores); without one, all on this thread.
  const keyer = startKeyWorker();
  let keyedByWorker = 0;
  try {
    ({ keyedByWorker } = await state.index.addAll(docs, keyer));
  } finally {
    keyer?.stop();
  }
  for (const doc of docs) noteDataset(state, doc);
  log('info', 'search: index built', { versions: state.index.size, ms: Date.now() - started, keyedByWorker });
  return state;
}

function addDoc(state: State, doc: SearchDoc): void {
  state.index.add(doc);
  noteDataset(state, doc);
}

function noteDataset(state: State, doc: SearchDoc): void {
  const set = state.byDataset.get(doc.datasetId) ?? new Set<string>();
  set.add(doc.versionId);
  state.byDataset.set(doc.datasetId, set);
}

/** Applies every logged change since the state's cursor: re-reads the changed datasets and replaces their versions. */
async function catchUp(state: State): Promise<void> {
  const startedAt = performance.now();
  const localSeen = localSearchChanges();
  for (;;) {
    const changes = await searchChangesSince(state.cursor);
    if (changes.lastId === state.cursor) break;
    if (changes.rebuild) {
      const fresh = await build();
      Object.assign(state, fresh);
      continue;
    }
    const sources = await loadPublishedSources(changes.datasetIds);
    const keep = new Set(sources.map((s) => s.versionId));
    for (const datasetId of changes.datasetIds) {
      const indexed = state.byDataset.get(datasetId) ?? new Set<string>();
      for (const versionId of [...indexed]) {
        if (keep.has(versionId)) continue;
        state.index.remove(versionId);
        indexed.delete(versionId);
      }
    }
    for (const doc of docsOf(sources)) addDoc(state, doc);
    state.cursor = changes.lastId;
  }
  state.caughtUpAt = startedAt;
  state.localSeen = localSeen;
}

/** Whether the log may hold entries this state has not applied: this instance committed one, or the interval passed. */
function mayBeBehind(state: State): boolean {
  return localSearchChanges() !== state.localSeen || performance.now() - state.caughtUpAt >= CATCH_UP_INTERVAL_MS;
}

async function current(): Promise<State> {
  holder.ohmsteadSearch ??= build().then(
    (state) => {
      holder.ohmsteadSearchReady = state;
      holder.ohmsteadSearchFailure = undefined;
      return state;
    },
    (error: unknown) => {
      holder.ohmsteadSearch = undefined; // try again on the next request
      holder.ohmsteadSearchFailure = error instanceof Error ? error.message : String(error);
      throw error;
    },
  );
  const state = await holder.ohmsteadSearch;
  if (!mayBeBehind(state)) return state;
  // One catch-up at a time per instance; concurrent requests wait for it rather than each re-reading the log. One that
  // started before this instance's latest commit may have missed it: then another follows.
  if (holder.ohmsteadSearchCatchUp) {
    await holder.ohmsteadSearchCatchUp;
    if (!mayBeBehind(state)) return state;
  }
  holder.ohmsteadSearchCatchUp ??= catchUp(state).finally(() => {
    holder.ohmsteadSearchCatchUp = undefined;
  });
  await holder.ohmsteadSearchCatchUp;
  return state;
}

/** Searches published versions as of the latest logged change (see SearchIndex.search for the query). */
export async function searchPublished(query: SearchQuery): Promise<SearchResult> {
  return (await current()).index.search(query);
}

/**
 * Starts building this instance's index now rather than on the first search (instrumentation.ts calls it as the server
 * starts): at 100k versions the build takes tens of seconds, which the first visitor would otherwise wait through.
 */
export function warmSearchIndex(): void {
  current().then(
    () => undefined, // build() logs 'search: index built' with its size and time
    (error: unknown) => log('warn', 'search: index not built at start; the first search will try again', {
      error: error instanceof Error ? error.message : String(error),
    }),
  );
}

/** Drops this instance's index (tests; `npm run reindex` asks every instance through the log instead). */
export function forgetSearchIndex(): void {
  holder.ohmsteadSearch = undefined;
  holder.ohmsteadSearchReady = undefined;
  holder.ohmsteadSearchFailure = undefined;
}

export type SearchIndexHealth =
  | { state: 'not-started' | 'building' }
  | { state: 'failed'; detail: string }
  | { state: 'ready'; versions: number; cursor: number; builtAt: string; caughtUpSecondsAgo: number };

/**
 * This instance's index as it stands, without building it or waiting for a build (for /api/health: at 100k versions
 * a build takes seconds). 'ready' gives the indexed versions, the last outbox entry applied and how long ago the log
 * was last read (a search reads it at most once a second; an idle instance catches up on its next search).
 */
export function searchIndexHealth(): SearchIndexHealth {
  const ready = holder.ohmsteadSearchReady;
  if (ready && holder.ohmsteadSearch) {
    return {
      state: 'ready', versions: ready.index.size, cursor: ready.cursor, builtAt: ready.builtAt.toISOString(),
      caughtUpSecondsAgo: Math.round((performance.now() - ready.caughtUpAt) / 100) / 10,
    };
  }
  if (holder.ohmsteadSearch) return { state: 'building' };
  if (holder.ohmsteadSearchFailure) return { state: 'failed', detail: holder.ohmsteadSearchFailure };
  return { state: 'not-started' };
}

export async function searchIndexStatus(): Promise<{ versions: number; cursor: number; builtAt: string }> {
  const s = await current();
  return { versions: s.index.size, cursor: s.cursor, builtAt: s.builtAt.toISOString() };
}
