// The transactional outbox against real MariaDB, and the 'doi.reserve' job against the DOI fake.
// Rules of the outbox (issue 4): claims are safe with several processes, retries back off
// exponentially (10 s, 20 s, … capped at 10 min), and a replayed reservation never makes a second DOI.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createDataset } from '@/lib/datasets/create-dataset';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { doiClient } from '@/lib/doi/client';
import { defaultOutboxHandlers, processOutboxOnce, tryOutboxJobNow } from '@/lib/outbox/process-outbox';
import { claimDue, enqueue, findOutboxRow, listOutboxRows, type OutboxRow } from '@/lib/outbox/repo';
import { closeDb, closedPortUrl, doiFake, fakeDoiRecord, makeTestLab, removeTestLab, type TestLab } from './fixtures';

let lab: TestLab;
const testTopics: string[] = [];
/** A topic no other code handles, so these tests only ever see their own jobs. */
function testTopic(): string {
  const topic = `test.outbox.${randomBytes(4).toString('hex')}`;
  testTopics.push(topic);
  return topic;
}

beforeAll(async () => {
  lab = await makeTestLab();
});
afterAll(async () => {
  await db()('outbox').whereIn('topic', testTopics).delete();
  await removeTestLab(lab);
  await closeDb();
});

/** Lets time pass for one job: its next try is due now. */
async function makeDue(id: number): Promise<void> {
  await db()('outbox').where({ id }).update({ next_attempt_at: db().raw('UTC_TIMESTAMP() - INTERVAL 1 SECOND') });
}

async function secondsUntilNextTry(id: number): Promise<number> {
  const row = await db()('outbox').where({ id }).first(db().raw('TIMESTAMPDIFF(SECOND, UTC_TIMESTAMP(), next_attempt_at) AS s'));
  return Number(row.s);
}

describe('outbox claims', () => {
  it('gives each due job to exactly one of several concurrent claimers, and counts the attempt', async () => {
    const topic = testTopic();
    const ids = [];
    for (let i = 0; i < 6; i++) ids.push(await enqueue(db(), topic, `agg-${i}`, { n: i }));
    const batches = await Promise.all([claimDue(topic, 6), claimDue(topic, 6), claimDue(topic, 6)]);
    const claimed = batches.flat().map((r) => r.id).sort((a, b) => a - b);
    expect(claimed).toEqual(ids);
    for (const id of ids) expect((await findOutboxRow(id))?.attempts).toBe(1);
    // Leased for 2 minutes: nobody else can claim them now.
    expect(await claimDue(topic, 6)).toEqual([]);
    expect(await secondsUntilNextTry(ids[0]!)).toBeGreaterThanOrEqual(118);
  });

  it('runs each job once across concurrent processOutboxOnce calls; failures retry later with backoff', async () => {
    const topic = testTopic();
    const seen: number[] = [];
    const handlers = {
      [topic]: async (payload: unknown) => {
        const n = (payload as { n: number }).n;
        seen.push(n);
        if (n === 3) throw new Error('cryostat controller did not answer');
      },
    };
    const ids = [];
    for (let i = 0; i < 5; i++) ids.push(await enqueue(db(), topic, `agg-${i}`, { n: i }));
    const [a, b] = await Promise.all([processOutboxOnce(handlers), processOutboxOnce(handlers)]);
    expect(a.claimed + b.claimed).toBe(5);
    expect(a.done + b.done).toBe(4);
    expect(a.failed + b.failed).toBe(1);
    expect(seen.sort()).toEqual([0, 1, 2, 3, 4]);

    const failed = (await findOutboxRow(ids[3]!))!;
    expect(failed).toMatchObject({ attempts: 1, processedAt: null, lastError: 'cryostat controller did not answer' });
    expect(await secondsUntilNextTry(failed.id)).toBeGreaterThanOrEqual(9);
    expect((await findOutboxRow(ids[0]!))?.processedAt).toBeInstanceOf(Date);

    // Not due yet: nothing runs. Due again: the second failure waits 20 s.
    expect((await processOutboxOnce(handlers)).claimed).toBe(0);
    await makeDue(failed.id);
    expect(await processOutboxOnce(handlers)).toEqual({ claimed: 1, done: 0, failed: 1 });
    expect((await findOutboxRow(failed.id))?.attempts).toBe(2);
    expect(await secondsUntilNextTry(failed.id)).toBeGreaterThanOrEqual(19);
  });

  it('holds a fresh job for its creator, who runs it once; a second try is skipped', async () => {
    const topic = testTopic();
    const runs: OutboxRow[] = [];
    const handlers = { [topic]: async (_p: unknown, row: OutboxRow) => void runs.push(row) };
    const id = await enqueue(db(), topic, 'agg', { hello: 'ohm' }, { holdMs: 60_000 });
    expect(await claimDue(topic, 10)).toEqual([]);
    expect(await tryOutboxJobNow(id, handlers)).toBe('done');
    expect(await tryOutboxJobNow(id, handlers)).toBe('skipped');
    expect(runs.map((r) => [r.id, r.attempts, r.payload])).toEqual([[id, 1, { hello: 'ohm' }]]);
  });
});

describe("the 'doi.reserve' job", () => {
  it('finishes a reservation that failed while the agency was down, and a replay makes no second DOI', async () => {
    // `npm test` also runs scripts/worker.ts, which takes due 'doi.reserve' jobs; here the job moves to a private
    // topic served by the same 'doi.reserve' handler, so only this test runs it and every step is observable.
    const parked = testTopic();
    const down = { [parked]: defaultOutboxHandlers({ doi: doiClient({ apiUrl: await closedPortUrl() }) })['doi.reserve']! };
    const up = { [parked]: defaultOutboxHandlers()['doi.reserve']! };
    const created = await createDataset(
      { user: lab.member, groupSlug: lab.slug, title: 'Magnetoresistance sweep at ±9 T, reserved later' },
      { doi: doiClient({ apiUrl: await closedPortUrl() }) },
    );
    expect(created.doiState).toBe('none');
    const [job] = await listOutboxRows('doi.reserve', created.versionId);

    // Still down at the next try: a second failure, 20 s backoff.
    await db()('outbox').where({ id: job!.id }).update({ topic: parked });
    await makeDue(job!.id);
    expect(await processOutboxOnce(down)).toEqual({ claimed: 1, done: 0, failed: 1 });
    expect(await findOutboxRow(job!.id)).toMatchObject({ attempts: 2, processedAt: null });
    expect((await findOutboxRow(job!.id))?.lastError).toContain('is unreachable (ECONNREFUSED)');
    expect(await secondsUntilNextTry(job!.id)).toBeGreaterThanOrEqual(19);
    expect((await findVersionRow(created.versionId))?.doi_state).toBe('none');

    // The agency is back: the default DOI client reaches the fake.
    await makeDue(job!.id);
    expect(await processOutboxOnce(up)).toEqual({ claimed: 1, done: 1, failed: 0 });
    const done = await findOutboxRow(job!.id);
    expect(done?.processedAt).toBeInstanceOf(Date);
    expect(done?.lastError).toBeNull();
    expect((await findVersionRow(created.versionId))?.doi_state).toBe('reserved');
    const first = await fakeDoiRecord(created.doi);
    expect(first).toMatchObject({ doi: created.doi, state: 'draft' });
    expect(await fakeDoiRecord(created.conceptDoi)).toMatchObject({ state: 'draft' });

    // Replay as after a crash between the agency's answer and our commit: the job and the state are back to before.
    await db()('dataset_versions').where({ id: created.versionId }).update({ doi_state: 'none' });
    await db()('outbox').where({ id: job!.id }).update({ processed_at: null, next_attempt_at: null });
    expect(await processOutboxOnce(up)).toEqual({ claimed: 1, done: 1, failed: 0 });
    expect((await findOutboxRow(job!.id))?.processedAt).toBeInstanceOf(Date);
    expect((await findVersionRow(created.versionId))?.doi_state).toBe('reserved');
    expect((await findVersionRow(created.versionId))?.doi).toBe(created.doi);
    const again = await fakeDoiRecord(created.doi);
    expect([again?.created, again?.updated]).toEqual([first?.created, first?.updated]); // untouched, not re-created
    const list = await doiFake('GET', '/dois?state=draft');
    const ids = (list.body?.data as { id: string }[]).map((d) => d.id);
    expect(ids.filter((id) => id === created.doi)).toHaveLength(1);
    expect(await listOutboxRows(parked, created.versionId)).toHaveLength(1);
  });

  it('completes without calling the agency when the version was deleted meanwhile', async () => {
    const created = await createDataset(
      { user: lab.member, groupSlug: lab.slug, title: 'Draft deleted before its DOI was reserved' },
      { doi: doiClient({ apiUrl: await closedPortUrl() }) },
    );
    await db()('datasets').where({ id: created.datasetId }).delete();
    const [job] = await listOutboxRows('doi.reserve', created.versionId);
    const parked = testTopic(); // away from the worker, as above
    await db()('outbox').where({ id: job!.id }).update({ topic: parked });
    await makeDue(job!.id);
    // The agency is unreachable for this client, so success shows it was never called.
    const down = { [parked]: defaultOutboxHandlers({ doi: doiClient({ apiUrl: await closedPortUrl() }) })['doi.reserve']! };
    expect(await processOutboxOnce(down)).toEqual({ claimed: 1, done: 1, failed: 0 });
    expect((await findOutboxRow(job!.id))?.processedAt).toBeInstanceOf(Date);
    expect(await fakeDoiRecord(created.doi)).toBeNull();
  });
});
