import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';

// The transactional outbox: follow-up work written with the change it follows, done after commit by whoever claims it.

export type OutboxRow = {
  id: number;
  topic: string;
  aggregateId: string;
  payload: unknown;
  attempts: number;
  nextAttemptAt: Date | null;
  processedAt: Date | null;
  lastError: string | null;
  createdAt: Date;
};

type RawRow = {
  id: number | string; topic: string; aggregate_id: string; payload: unknown; attempts: number; next_attempt_at: Date | null;
  processed_at: Date | null; last_error: string | null; created_at: Date;
};

/** How long a claim keeps other processes away from a job before it counts as abandoned. */
export const DEFAULT_LEASE_MS = 2 * 60_000;

const inFuture = (ms: number) => db().raw('DATE_ADD(UTC_TIMESTAMP(3), INTERVAL ? MICROSECOND)', [Math.round(ms * 1000)]);

function toRow(r: RawRow): OutboxRow {
  return {
    id: Number(r.id), topic: r.topic, aggregateId: r.aggregate_id,
    payload: typeof r.payload === 'string' ? JSON.parse(r.payload) : r.payload,
    attempts: r.attempts, nextAttemptAt: r.next_attempt_at, processedAt: r.processed_at, lastError: r.last_error, createdAt: r.created_at,
  };
}

function due(q: Knex.QueryBuilder): Knex.QueryBuilder {
  return q.whereNull('processed_at').where((w) => w.whereNull('next_attempt_at').orWhereRaw('next_attempt_at <= UTC_TIMESTAMP(3)'));
}

/**
 * Adds a job inside the caller's transaction. `holdMs` keeps workers off it for a while, for a caller that
 * tries the job itself right after commit (it then claims it with claimFresh).
 */
export async function enqueue(trx: Knex | Knex.Transaction, topic: string, aggregateId: string, payload: unknown, options: { holdMs?: number } = {}): Promise<number> {
  const [id] = await trx('outbox').insert({
    topic,
    aggregate_id: aggregateId,
    payload: JSON.stringify(payload),
    next_attempt_at: options.holdMs ? trx.raw('DATE_ADD(UTC_TIMESTAMP(3), INTERVAL ? MICROSECOND)', [Math.round(options.holdMs * 1000)]) : null,
  });
  return Number(id);
}

/** Claims one row by a conditional UPDATE, so two processes never both win it; the claim lasts `leaseMs`. */
async function claimOne(id: number, condition: (q: Knex.QueryBuilder) => Knex.QueryBuilder, leaseMs: number): Promise<OutboxRow | undefined> {
  const changed = await condition(db()('outbox').where('id', id)).update({ attempts: db().raw('attempts + 1'), next_attempt_at: inFuture(leaseMs) });
  return changed === 1 ? findOutboxRow(id) : undefined;
}

/** Claims up to `limit` due jobs (oldest first) of the given topic(s); each claimed row has its attempts counted. */
export async function claimDue(topic?: string | readonly string[], limit = 10, leaseMs = DEFAULT_LEASE_MS): Promise<OutboxRow[]> {
  const topics = topic === undefined ? undefined : typeof topic === 'string' ? [topic] : [...topic];
  if (topics?.length === 0) return [];
  const candidates = due(db()('outbox'));
  if (topics) candidates.whereIn('topic', topics);
  const ids: { id: number }[] = await candidates.orderBy('id').limit(limit).select('id');
  const claimed: OutboxRow[] = [];
  for (const { id } of ids) {
    const row = await claimOne(Number(id), due, leaseMs);
    if (row) claimed.push(row);
  }
  return claimed;
}

/** Claims a job nobody has tried yet (the creator's own first try right after commit). */
export async function claimFresh(id: number, leaseMs = DEFAULT_LEASE_MS): Promise<OutboxRow | undefined> {
  return claimOne(id, (q) => q.whereNull('processed_at').where('attempts', 0), leaseMs);
}

export async function markProcessed(id: number): Promise<void> {
  await db()('outbox').where('id', id).update({ processed_at: db().raw('UTC_TIMESTAMP()'), last_error: null, next_attempt_at: null });
}

/** Extends a claimed job's lease to `leaseMs` from now (a long-running job); false when the job is no longer open. */
export async function renewClaim(id: number, leaseMs = DEFAULT_LEASE_MS): Promise<boolean> {
  return (await db()('outbox').where('id', id).whereNull('processed_at').update({ next_attempt_at: inFuture(leaseMs) })) === 1;
}

/** Gives a claimed job back untried (its process is stopping): due again at once, the try not counted. */
export async function releaseClaim(id: number): Promise<void> {
  await db()('outbox').where('id', id).whereNull('processed_at')
    .update({ attempts: db().raw('GREATEST(attempts - 1, 0)'), next_attempt_at: null });
}

/** Closes a job that will not be tried again, keeping why in last_error. */
export async function markAbandoned(id: number, error: string): Promise<void> {
  await db()('outbox').where('id', id).whereNull('processed_at')
    .update({ processed_at: db().raw('UTC_TIMESTAMP()'), last_error: error.slice(0, 4000), next_attempt_at: null });
}

/** Records a failed try and when to try again. */
export async function markFailed(id: number, error: string, retryInMs: number): Promise<void> {
  await db()('outbox').where('id', id).whereNull('processed_at').update({ last_error: error.slice(0, 4000), next_attempt_at: inFuture(retryInMs) });
}

export async function findOutboxRow(id: number): Promise<OutboxRow | undefined> {
  const row = await db()<RawRow>('outbox').where('id', id).first();
  return row ? toRow(row) : undefined;
}

export async function listOutboxRows(topic: string, aggregateId: string): Promise<OutboxRow[]> {
  const rows: RawRow[] = await db()('outbox').where({ topic, aggregate_id: aggregateId }).orderBy('id');
  return rows.map(toRow);
}
