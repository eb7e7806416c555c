import 'server-only';
import type { DoiClient } from '@/lib/doi/client';
import { handleDoiReserve } from '@/lib/doi/reserve-draft-doi';
import { log } from '@/lib/log';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { reviewOutboxHandlers } from '@/lib/review/outbox-handlers';
import { searchOutboxHandlers } from '@/lib/search/search-changed';
import { retryDelayMs } from './backoff';
import { claimDue, claimFresh, markAbandoned, markFailed, markProcessed, releaseClaim, type OutboxRow } from './repo';

export type OutboxHandler = (payload: unknown, row: OutboxRow) => Promise<void>;
export type OutboxHandlers = Readonly<Record<string, OutboxHandler>>;
export type OutboxCounts = { claimed: number; done: number; failed: number };

/**
 * Thrown by a handler for a job that must not be tried again (it has failed for long enough, or can never succeed):
 * the job is closed with the message in last_error instead of being scheduled for another try.
 */
export class JobAbandoned extends Error {}

/**
 * Thrown by a handler whose try was cut short by its own process stopping (not by the job): the job is given back
 * untried, due again at once for the next worker, and the try does not count against any limit.
 */
export class JobInterrupted extends Error {}

/** The jobs this app knows how to do; `doi` swaps the DOI client (e.g. another agency endpoint). */
export function defaultOutboxHandlers(options: { doi?: DoiClient } = {}): OutboxHandlers {
  return {
    'doi.reserve': (payload) => handleDoiReserve(payload, options.doi),
    ...publishingOutboxHandlers(),
    ...reviewOutboxHandlers(),
    ...searchOutboxHandlers(),
  };
}

/** Runs one claimed job; on failure schedules the next try with backoff. True when the job is done. */
async function runClaimed(row: OutboxRow, handlers: OutboxHandlers): Promise<boolean> {
  const handler = handlers[row.topic];
  try {
    if (!handler) throw new Error(`no handler for outbox topic ${row.topic}`);
    await handler(row.payload, row);
    await markProcessed(row.id);
    return true;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (error instanceof JobInterrupted) {
      await releaseClaim(row.id);
      log('info', 'outbox job given back: this process is stopping', { id: row.id, topic: row.topic });
      return false;
    }
    if (error instanceof JobAbandoned) {
      await markAbandoned(row.id, message);
      log('error', 'outbox job abandoned', { id: row.id, topic: row.topic, attempts: row.attempts, error: message });
      return false;
    }
    const delay = retryDelayMs(row.attempts);
    await markFailed(row.id, message, delay);
    log('warn', 'outbox job failed; will retry', { id: row.id, topic: row.topic, attempts: row.attempts, retryInMs: delay, error: message });
    return false;
  }
}

/** Claims and runs the due jobs of the topics `handlers` knows; safe to run in several processes at once. */
export async function processOutboxOnce(handlers: OutboxHandlers = defaultOutboxHandlers(), options: { limit?: number } = {}): Promise<OutboxCounts> {
  const rows = await claimDue(Object.keys(handlers), options.limit ?? 20);
  const counts: OutboxCounts = { claimed: rows.length, done: 0, failed: 0 };
  for (const row of rows) {
    if (await runClaimed(row, handlers)) counts.done += 1;
    else counts.failed += 1;
  }
  return counts;
}

/**
 * The creator's first try of a job it just committed (enqueued with a hold). 'skipped' when another process
 * already took it.
 */
export async function tryOutboxJobNow(id: number, handlers: OutboxHandlers = defaultOutboxHandlers()): Promise<'done' | 'failed' | 'skipped'> {
  const row = await claimFresh(id);
  if (!row) return 'skipped';
  return (await runClaimed(row, handlers)) ? 'done' : 'failed';
}
