// COUNTER counting against MariaDB: the double-click filter on stored events (domain.md check values: 10:01:00 and
// 10:01:29 → 1; 10:01:35 → 2), robots left out, unique per user-session, totals per version and per group.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { recordUsage } from '@/lib/counter/record-usage';
import { getGroupUsage, getVersionUsage } from '@/lib/counter/usage-report';
import { createReviewerLink } from '@/lib/review/create-reviewer-link';
import { closeDb, makeReviewLab, makeVersion, rejection, removeReviewLab, type ReviewLab } from '../review/fixtures';

let lab: ReviewLab;
const FIREFOX = 'Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0';
const SAFARI = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_4 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.4 Mobile/15E148 Safari/604.1';
const visitor = (ip: string, userAgent = FIREFOX) => ({ userId: null, ip, userAgent });
const at = (hms: string) => new Date(`2031-03-01T${hms}Z`);

beforeAll(async () => {
  lab = await makeReviewLab('counter');
});
afterAll(async () => {
  await removeReviewLab(lab);
  await closeDb();
});

describe('recordUsage: double-click filter on stored events', () => {
  it('10:01:00 and 10:01:29 → 1; 10:01:35 → 2 (domain.md)', async () => {
    const versionId = await makeVersion(lab, 'published', 'Double-click check values');
    const flags = [];
    for (const t of ['10:01:00', '10:01:29', '10:01:35']) {
      flags.push((await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.10'), now: at(t) })).counted);
    }
    expect(flags).toEqual([true, false, true]);
    expect(await getVersionUsage(versionId)).toEqual({ investigations: { total: 2, unique: 1 }, requests: { total: 0, unique: 0 } });
    const rows = await db()('download_events').where('version_id', versionId).orderBy('created_at').select('created_at', 'counted');
    expect(rows.map((r: { created_at: Date; counted: number }) => [r.created_at.toISOString(), Boolean(r.counted)])).toEqual([
      ['2031-03-01T10:01:00.000Z', true], ['2031-03-01T10:01:29.000Z', false], ['2031-03-01T10:01:35.000Z', true],
    ]);
  });

  it('a different file, another kind or another visitor within 30 s is counted', async () => {
    const versionId = await makeVersion(lab, 'published', 'Several items');
    const fileA = crypto.randomUUID();
    const fileB = crypto.randomUUID();
    await db()('files').insert([
      { id: fileA, version_id: versionId, name: 'rt-sweep.csv', size_bytes: 10, upload_state: 'verified' },
      { id: fileB, version_id: versionId, name: 'hall-9T.csv', size_bytes: 10, upload_state: 'verified' },
    ]);
    const v = visitor('192.0.2.11');
    const counted = async (kind: 'investigation' | 'request', fileId: string | null, hms: string, who = v) =>
      (await recordUsage({ versionId, kind, fileId, viewer: who, now: at(hms) })).counted;
    expect(await counted('request', fileA, '10:00:00')).toBe(true);
    expect(await counted('request', fileA, '10:00:05')).toBe(false);
    expect(await counted('request', fileB, '10:00:06')).toBe(true);
    expect(await counted('request', null, '10:00:07')).toBe(true); // the package
    expect(await counted('investigation', null, '10:00:08')).toBe(true);
    expect(await counted('request', fileA, '10:00:09', visitor('192.0.2.12'))).toBe(true);
    expect(await counted('request', fileA, '10:00:10', visitor('192.0.2.11', SAFARI))).toBe(true);
    // investigations include requests (COUNTER); uniques are per session: 3 sessions, all of which requested
    expect(await getVersionUsage(versionId)).toEqual({ investigations: { total: 6, unique: 3 }, requests: { total: 5, unique: 3 } });
  });

  it('catches a double-click across the turn of the hour', async () => {
    const versionId = await makeVersion(lab, 'published', 'Hour turn');
    const first = await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.13'), now: at('10:59:50') });
    const second = await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.13'), now: at('11:00:10') });
    expect([first.counted, second.counted]).toEqual([true, false]);
  });
});

describe('robots and sessions', () => {
  it('robots are logged but never counted', async () => {
    const versionId = await makeVersion(lab, 'published', 'Robots');
    const bot = await recordUsage({ versionId, kind: 'request', viewer: visitor('192.0.2.20', 'Mozilla/5.0 (compatible; Googlebot/2.1; +http://www.google.com/bot.html)'), now: at('09:00:00') });
    const script = await recordUsage({ versionId, kind: 'request', viewer: visitor('192.0.2.21', 'python-requests/2.31.0'), now: at('09:00:01') });
    const person = await recordUsage({ versionId, kind: 'request', viewer: visitor('192.0.2.22'), now: at('09:00:02') });
    expect([bot.robot, script.robot, person.robot]).toEqual([true, true, false]);
    expect(await db()('download_events').where('version_id', versionId).count({ n: '*' })).toEqual([{ n: 3 }]);
    expect(await getVersionUsage(versionId)).toEqual({ investigations: { total: 1, unique: 1 }, requests: { total: 1, unique: 1 } });
  });

  it('a robot never makes a person’s use within 30 s a double-click (anonymous links share one session)', async () => {
    const versionId = await makeVersion(lab, 'in_review', 'Robot then person');
    const { link } = await createReviewerLink({ user: lab.member, versionId, input: { label: 'Shared session', anonymous: true } });
    const reviewerLink = { id: link.id, anonymous: true };
    const bot = await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.23', 'curl/8.5.0'), reviewerLink, now: at('09:30:00') });
    const person = await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.24'), reviewerLink, now: at('09:30:05') });
    const again = await recordUsage({ versionId, kind: 'investigation', viewer: visitor('192.0.2.24'), reviewerLink, now: at('09:30:09') });
    expect([bot.robot, person.counted, again.counted]).toEqual([true, true, false]);
    expect(await getVersionUsage(versionId)).toEqual({ investigations: { total: 1, unique: 1 }, requests: { total: 0, unique: 0 } });
  });

  it('a signed-in user is one session across addresses within the hour, and the user id is kept; the IP is not', async () => {
    const versionId = await makeVersion(lab, 'published', 'Signed-in sessions');
    const u = { userId: lab.outsider.id, userAgent: FIREFOX };
    await recordUsage({ versionId, kind: 'investigation', viewer: { ...u, ip: '192.0.2.30' }, now: at('12:00:00') });
    await recordUsage({ versionId, kind: 'investigation', viewer: { ...u, ip: '203.0.113.30' }, now: at('12:20:00') });
    await recordUsage({ versionId, kind: 'investigation', viewer: { ...u, ip: '192.0.2.30' }, now: at('13:05:00') });
    expect(await getVersionUsage(versionId)).toEqual({ investigations: { total: 3, unique: 2 }, requests: { total: 0, unique: 0 } });
    const stored = await db()('download_events').where('version_id', versionId).select('*');
    expect(stored.map((r: { user_id: string }) => r.user_id)).toEqual([lab.outsider.id, lab.outsider.id, lab.outsider.id]);
    expect(JSON.stringify(stored)).not.toMatch(/192\.0\.2\.30|203\.0\.113\.30|Firefox/);
  });
});

describe('getGroupUsage', () => {
  it('gives curators per-version and total metrics within a period', async () => {
    const a = await makeVersion(lab, 'published', 'Group report A');
    const b = await makeVersion(lab, 'published', 'Group report B');
    await recordUsage({ versionId: a, kind: 'investigation', viewer: visitor('192.0.2.40'), now: new Date('2031-05-03T08:00:00Z') });
    await recordUsage({ versionId: a, kind: 'request', viewer: visitor('192.0.2.40'), now: new Date('2031-05-03T08:00:05Z') });
    await recordUsage({ versionId: b, kind: 'investigation', viewer: visitor('192.0.2.41'), now: new Date('2031-05-20T08:00:00Z') });
    await recordUsage({ versionId: b, kind: 'investigation', viewer: visitor('192.0.2.41'), now: new Date('2031-06-02T08:00:00Z') });

    const may = await getGroupUsage({ user: lab.curator, groupSlug: lab.slug, from: new Date('2031-05-01T00:00:00Z'), to: new Date('2031-06-01T00:00:00Z') });
    expect(may.versions.map((v) => [v.title, v.usage])).toEqual([
      ['Group report A', { investigations: { total: 2, unique: 1 }, requests: { total: 1, unique: 1 } }],
      ['Group report B', { investigations: { total: 1, unique: 1 }, requests: { total: 0, unique: 0 } }],
    ]);
    expect(may.totals).toEqual({ investigations: { total: 3, unique: 2 }, requests: { total: 1, unique: 1 } });
    expect([may.from, may.to]).toEqual(['2031-05-01T00:00:00.000Z', '2031-06-01T00:00:00.000Z']);
  });

  it('refuses members (403), outsiders (403) and anonymous visitors (401); unknown groups are 404', async () => {
    for (const [user, status] of [[lab.member, 403], [lab.outsider, 403], [null, 401]] as const) {
      expect((await rejection(getGroupUsage({ user, groupSlug: lab.slug }))).status).toBe(status);
    }
    expect((await rejection(getGroupUsage({ user: lab.owner, groupSlug: `${lab.slug}-none` }))).status).toBe(404);
  });
});
