// The SMTP relay is down when a mail job runs (issue 8 item 6): a private SMTP fake is stopped, the job stays queued
// with the error; after the restart it is delivered exactly once. The shared SMTP fake is never stopped.
import { randomBytes, randomUUID } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { MAIL_TOPIC, type MailPayload } from '@/lib/notify/mail-jobs';
import { sendQueuedMail } from '@/lib/notify/send-queued-mail';
import { processOutboxOnce, tryOutboxJobNow, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { enqueue, findOutboxRow } from '@/lib/outbox/repo';
import { publishingOutboxHandlers } from '@/lib/publishing/outbox-handlers';
import { privateSmtpFake, type PrivateService } from './private-services';

let smtp: PrivateService & { smtpUrl: string };
const aggregateId = randomUUID();

beforeAll(async () => {
  smtp = await privateSmtpFake();
  await smtp.start();
}, 60_000);

afterAll(async () => {
  try {
    await db()('outbox').where({ aggregate_id: aggregateId }).delete();
    await db().destroy();
    (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
  } finally {
    await smtp?.dispose();
  }
}, 60_000);

/** Subjects of the messages the private fake has kept (one .json per accepted message). */
function keptSubjects(): string[] {
  return readdirSync(smtp.layout.mail).filter((f) => f.endsWith('.json'))
    .map((f) => (JSON.parse(readFileSync(path.join(smtp.layout.mail, f), 'utf8')) as { subject: string }).subject);
}

describe('SMTP relay down', () => {
  it('the mail job stays queued with the error, and is delivered once after the restart', async () => {
    const subject = `Fault drill ${randomBytes(4).toString('hex')}: Larkspur Cryogenic Lab notice`;
    const payload: MailPayload = {
      to: 'fault-drill@tests.ohmstead.example', subject, kind: 'fault.drill',
      text: 'An invented notice for the SMTP fault test.', html: '<p>An invented notice for the SMTP fault test.</p>',
    };
    const mailTo = (smtpUrl: string): OutboxHandlers => ({ [MAIL_TOPIC]: (p) => sendQueuedMail(p, { smtpUrl, timeoutMs: 3_000 }) });
    // Held an hour, so the shared worker leaves it to this test (the creator tries it at once, as the app does).
    const id = await enqueue(db(), MAIL_TOPIC, aggregateId, payload, { holdMs: 3600_000 });

    await smtp.stop();
    expect(await tryOutboxJobNow(id, mailTo(smtp.smtpUrl))).toBe('failed');
    await db()('outbox').where({ id }).update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) + INTERVAL 1 HOUR') });
    const queued = await findOutboxRow(id);
    expect(queued).toMatchObject({ attempts: 1, processedAt: null });
    expect(queued?.lastError).toBe(`connect ECONNREFUSED 127.0.0.1:${smtp.port}`);
    expect(keptSubjects()).toEqual([]);

    await smtp.start();
    // Only this job goes to the private relay; any other due mail job is sent as the shared worker would send it.
    const shared = publishingOutboxHandlers();
    const routed: OutboxHandlers = {
      [MAIL_TOPIC]: (p, row) => (row.id === id ? mailTo(smtp.smtpUrl) : shared)[MAIL_TOPIC]!(p, row),
    };
    await db()('outbox').where({ id }).update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    await processOutboxOnce(routed, { limit: 100 });
    await processOutboxOnce(routed, { limit: 100 });
    const done = await findOutboxRow(id);
    expect(done).toMatchObject({ attempts: 2, lastError: null });
    expect(done?.processedAt).toBeInstanceOf(Date);
    expect(keptSubjects()).toEqual([subject]);
  }, 60_000);
});
