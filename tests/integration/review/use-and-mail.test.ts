// Link uses (views, downloads, last_used_at, audit) with no reviewer identity stored, and the mail to a referee
// through the outbox and the SMTP fake (tests/support/mailbox.ts). Rules: issue 6 "Reviewer links".
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { sessionHash } from '@/lib/counter/session-hash';
import { createReviewerLink } from '@/lib/review/create-reviewer-link';
import { getLinkAccessLog, listReviewerLinks } from '@/lib/review/list-reviewer-links';
import { reviewOutboxHandlers, REVIEW_MAIL_TOPIC } from '@/lib/review/outbox-handlers';
import { recordLinkUse } from '@/lib/review/record-link-use';
import { resolveReviewerLink, type ResolvedLink } from '@/lib/review/resolve-reviewer-link';
import { revokeReviewerLink } from '@/lib/review/revoke-reviewer-link';
import { sendReviewerLink } from '@/lib/review/send-reviewer-link';
import { processOutboxOnce } from '@/lib/outbox/process-outbox';
import { waitForMail } from '@/tests/support/mailbox';
import { uniqueEmail } from '@/tests/support/unique';
import { closedPortUrl } from '../publishing/fixtures';
import { closeDb, makeReviewLab, makeVersion, rejection, removeReviewLab, type ReviewLab } from './fixtures';

let lab: ReviewLab;
let versionId: string;
const IP = '198.51.100.23';
const UA = 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0 ReviewerProbe/9.7';
const handlers = reviewOutboxHandlers();

beforeAll(async () => {
  lab = await makeReviewLab('review-use');
  const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
  versionId = await makeVersion(lab, 'published', 'Embargoed: ρ(T) of an invented cuprate film', inDays(90));
});
afterAll(async () => {
  await removeReviewLab(lab);
  await closeDb();
});

/** JSON columns come back parsed or as text, depending on the server's column type. */
const payloadOf = (p: unknown): unknown => (typeof p === 'string' ? JSON.parse(p) : p);

async function resolved(token: string): Promise<ResolvedLink> {
  const r = await resolveReviewerLink(token);
  if (!r.ok) throw new Error(`link did not resolve: ${r.reason}`);
  return r;
}

/** Every stored row that could hold a trace of the reviewer, as one string. */
async function everythingStoredAbout(linkId: string): Promise<string> {
  const rows = await Promise.all([
    db()('download_events').where('reviewer_link_id', linkId),
    db()('audit_log').where('target_id', linkId),
    db()('reviewer_links').where('id', linkId),
    db()('outbox').where('aggregate_id', linkId),
  ]);
  return JSON.stringify(rows);
}

describe('recordLinkUse', () => {
  it('logs views and downloads with time and kind, sets last_used_at, and counts them in the list', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Referee A' } });
    const link = await resolved(created.token);
    const t0 = new Date(Date.now() - 120_000);
    await recordLinkUse({ link, event: 'view', viewer: { ip: IP, userAgent: UA }, now: t0 });
    await recordLinkUse({ link, event: 'view', viewer: { ip: IP, userAgent: UA }, now: new Date(t0.getTime() + 10_000) });
    await recordLinkUse({ link, event: 'download', viewer: { ip: IP, userAgent: UA }, now: new Date(t0.getTime() + 60_000) });

    const events = await db()('download_events').where('reviewer_link_id', created.link.id).orderBy('id').select('kind', 'user_id', 'counted', 'is_robot', 'created_at');
    expect(events.map((e: { kind: string; user_id: string | null; counted: number }) => [e.kind, e.user_id, Boolean(e.counted)])).toEqual([
      ['investigation', null, true], ['investigation', null, false], ['request', null, true],
    ]);
    expect((events[2].created_at as Date).toISOString()).toBe(new Date(t0.getTime() + 60_000).toISOString());
    const row = await db()('reviewer_links').where('id', created.link.id).first('last_used_at');
    expect(Math.floor(new Date(t0.getTime() + 60_000).getTime() / 1000)).toBe(Math.floor((row.last_used_at as Date).getTime() / 1000));

    const listed = (await listReviewerLinks({ user: lab.member, versionId })).find((l) => l.id === created.link.id);
    expect(listed?.uses).toEqual({ views: 2, downloads: 1 });

    const audit = await db()('audit_log').where({ target_id: created.link.id, action: 'reviewer_link.use' }).orderBy('id').select('actor_kind', 'actor_user_id', 'ip_hash', 'details');
    expect(audit).toHaveLength(3);
    for (const a of audit) expect([a.actor_kind, a.actor_user_id, a.ip_hash]).toEqual(['reviewer', null, null]);
  });

  it('gives stewards the access log (time, event, link label) and refuses it to members (403)', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Referee B' } });
    const link = await resolved(created.token);
    const at = new Date(Date.now() - 5_000);
    await recordLinkUse({ link, event: 'download', viewer: { ip: IP, userAgent: 'curl/8.5.0' }, now: at });
    const log = await getLinkAccessLog({ user: lab.curator, versionId });
    expect(log.find((e) => e.linkId === created.link.id)).toEqual({
      at: at.toISOString(), event: 'download', linkId: created.link.id, linkLabel: 'Referee B', counted: false, robot: true,
    });
    const e = await rejection(getLinkAccessLog({ user: lab.member, versionId }));
    expect([e.status, e.code]).toEqual([403, 'forbidden']);
  });

  it('anonymous mode stores no IP, user agent or client hash anywhere: the session is the link', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Anonymous C', anonymous: true } });
    const link = await resolved(created.token);
    const at = new Date();
    await recordLinkUse({ link, event: 'view', viewer: { ip: IP, userAgent: UA }, now: at });
    await recordLinkUse({ link, event: 'download', viewer: { ip: IP, userAgent: UA }, now: at });

    const stored = await everythingStoredAbout(created.link.id);
    for (const trace of [IP, UA, 'ReviewerProbe', 'Firefox']) expect(stored).not.toContain(trace);
    const secret = process.env.NEXTAUTH_SECRET!;
    const hashes: string[] = await db()('download_events').where('reviewer_link_id', created.link.id).pluck('session_hash');
    expect(hashes).toEqual([sessionHash(secret, { kind: 'link', linkId: created.link.id }, at), sessionHash(secret, { kind: 'link', linkId: created.link.id }, at)]);
    expect(hashes).not.toContain(sessionHash(secret, { kind: 'client', ip: IP, userAgent: UA }, at));
  });
});

describe('sendReviewerLink', () => {
  it('mails the link to the referee with text and HTML parts, names the sender, and keeps no address or link', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Referee D' } });
    const to = uniqueEmail('referee');
    const since = new Date(Date.now() - 1000);
    const result = await sendReviewerLink({ user: lab.member, linkId: created.link.id, input: { email: to, token: created.token, message: 'Thank you for refereeing.' } });
    expect(result).toEqual({ linkId: created.link.id, delivery: 'sent' });

    const mail = await waitForMail({ to, since, subject: 'Confidential review copy: Embargoed: ρ(T) of an invented cuprate film' });
    expect(mail.text).toContain(`Open the review copy: ${created.url}`);
    expect(mail.text).toContain(`Liesl Damaris (${lab.name}) has given you private access`);
    expect(mail.text).toContain('> Thank you for refereeing.');
    expect(mail.html).toContain(`href="${created.url}"`);

    const stored = await everythingStoredAbout(created.link.id);
    expect(stored).not.toContain(to);
    expect(stored).not.toContain(created.token);
    const jobs = await db()('outbox').where({ aggregate_id: created.link.id, topic: REVIEW_MAIL_TOPIC }).select('payload', 'processed_at');
    expect(jobs).toHaveLength(1);
    expect(jobs[0].processed_at).toBeInstanceOf(Date);
    expect(payloadOf(jobs[0].payload)).toEqual({ linkId: created.link.id, delivered: true });
    expect(await db()('audit_log').where({ target_id: created.link.id }).orderBy('id').pluck('action')).toEqual(['reviewer_link.create', 'reviewer_link.send']);
  });

  it('in anonymous mode the mail names neither the sender nor the group', async () => {
    const created = await createReviewerLink({ user: lab.owner, versionId, input: { label: 'Referee E', anonymous: true } });
    const to = uniqueEmail('referee');
    const since = new Date(Date.now() - 1000);
    await sendReviewerLink({ user: lab.owner, linkId: created.link.id, input: { email: to, token: created.token } });
    const mail = await waitForMail({ to, since });
    expect(mail.text).toContain('The authors of a dataset on Ohmstead have given you private access to it for review.');
    for (const part of [mail.subject, mail.text, mail.html ?? '']) {
      expect(part).not.toContain('Maren Tolliver');
      expect(part).not.toContain(lab.name);
    }
  });

  it('with SMTP down the mail waits sealed in the outbox (202-style "queued") and goes out on a later run', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Referee F' } });
    const to = uniqueEmail('referee');
    const since = new Date(Date.now() - 1000);
    const down = reviewOutboxHandlers({ mail: { smtpUrl: (await closedPortUrl()).replace('http:', 'smtp:'), timeoutMs: 2000 } });
    const result = await sendReviewerLink({ user: lab.member, linkId: created.link.id, input: { email: to, token: created.token } }, { handlers: down });
    expect(result.delivery).toBe('queued');
    const waiting = await db()('outbox').where({ aggregate_id: created.link.id }).first('payload', 'processed_at', 'last_error');
    expect(waiting.processed_at).toBeNull();
    expect(JSON.stringify(waiting.payload)).not.toContain(to);
    expect(JSON.stringify(waiting.payload)).not.toContain(created.token);
    expect(Object.keys(payloadOf(waiting.payload) as object)).toEqual(['linkId', 'sealed']);

    await db()('outbox').where({ aggregate_id: created.link.id }).update({ next_attempt_at: db().raw('UTC_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    await processOutboxOnce(handlers, { limit: 50 });
    const mail = await waitForMail({ to, since });
    expect(mail.text).toContain(created.url);
    const done = await db()('outbox').where({ aggregate_id: created.link.id }).first('payload', 'processed_at');
    expect(done.processed_at).toBeInstanceOf(Date);
    expect(payloadOf(done.payload)).toEqual({ linkId: created.link.id, delivered: true });
  });

  it('refuses a wrong token (422), a revoked link (409) and outsiders (403 on a published version)', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Referee G' } });
    const email = uniqueEmail('referee');
    const wrong = await rejection(sendReviewerLink({ user: lab.member, linkId: created.link.id, input: { email, token: `${created.token.slice(0, 42)}x` } }, { handlers }));
    expect([wrong.status, Object.keys(wrong.details?.fieldErrors ?? {})]).toEqual([422, ['token']]);
    const outsider = await rejection(sendReviewerLink({ user: lab.outsider, linkId: created.link.id, input: { email, token: created.token } }, { handlers }));
    expect([outsider.status, outsider.code]).toEqual([403, 'forbidden']);
    await revokeReviewerLink({ user: lab.member, linkId: created.link.id });
    const revoked = await rejection(sendReviewerLink({ user: lab.member, linkId: created.link.id, input: { email, token: created.token } }, { handlers }));
    expect([revoked.status, revoked.message]).toEqual([409, 'This review link has been revoked; create a new link to send.']);
    expect(await db()('outbox').where({ aggregate_id: created.link.id }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
