// The reviewer's download routes as Next calls them (Request in, Response out): unknown, tampered and truncated
// tokens → 404, expired and revoked links → 403 with the words the reviewer page uses, live links → the bytes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GET as getFile } from '@/app/(review)/review/[token]/files/[fileId]/route';
import { GET as getPackage } from '@/app/(review)/review/[token]/package/route';
import { db } from '@/lib/db';
import { LINK_PROBLEM_MESSAGES } from '@/lib/review/resolve-reviewer-link';
import { generateReviewToken } from '@/lib/review/token';
import { closeDb, dropDownloadLabs, makeDownloadLab, makeVersion, reviewerLink, type DownloadLab, type StoredFile } from './fixtures';

let lab: DownloadLab;
let versionId: string;
let file: StoredFile;
let token: string;
const CSV = 'T (K),R (Ohm)\n300,1.7200\n250,1.4100\n200,1.0900\n';

beforeAll(async () => {
  lab = await makeDownloadLab();
  const made = await makeVersion(lab, { state: 'in_review', files: [{ name: 'rt.csv', bytes: CSV }] });
  versionId = made.versionId;
  file = made.files[0]!;
  token = (await reviewerLink(lab, versionId, true)).token;
});
afterAll(async () => {
  await dropDownloadLabs();
  await closeDb();
});

const base = 'http://localhost:3000/review';
const packageOf = (t: string, headers: Record<string, string> = {}) =>
  getPackage(new Request(`${base}/${t}/package`, { headers }), { params: Promise.resolve({ token: t }) });
const fileOf = (t: string, fileId: string, headers: Record<string, string> = {}) =>
  getFile(new Request(`${base}/${t}/files/${fileId}`, { headers }), { params: Promise.resolve({ token: t, fileId }) });

describe('reviewer download routes', () => {
  it('answer 404 with one page for unknown, tampered and truncated tokens', async () => {
    const flipped = `${token.slice(0, 20)}${token[20] === 'A' ? 'B' : 'A'}${token.slice(21)}`;
    for (const t of [generateReviewToken(), flipped, token.slice(0, 30), '']) {
      const res = await packageOf(t);
      expect(res.status).toBe(404);
      expect(res.headers.get('content-type')).toBe('text/html; charset=utf-8');
      const html = await res.text();
      expect(html).toContain('<h1>Review link not found</h1>');
      expect(html).toContain(LINK_PROBLEM_MESSAGES.not_found);
    }
  });

  it('send a live link its package (no-referrer, not cached) and its file, with Range', async () => {
    const res = await packageOf(token, { 'x-request-id': 'review-pkg-1' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/zip');
    expect(res.headers.get('referrer-policy')).toBe('no-referrer');
    expect(res.headers.get('cache-control')).toBe('private, no-store, no-transform');
    expect(res.headers.get('x-request-id')).toBe('review-pkg-1');
    const zip = Buffer.from(await res.arrayBuffer());
    expect(zip.subarray(0, 4).equals(Buffer.from('PK\x03\x04', 'latin1'))).toBe(true);
    expect(zip.includes(Buffer.from(CSV))).toBe(true); // stored, not deflated: the payload's bytes appear as they are

    const whole = await fileOf(token, file.id);
    expect(whole.status).toBe(200);
    expect(await whole.text()).toBe(CSV);
    const part = await fileOf(token, file.id, { range: 'bytes=14-23' });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 14-23/${CSV.length}`);
    expect(await part.text()).toBe('300,1.7200');
  });

  it("answer 404 for a file of another version, through a live link", async () => {
    const other = await makeVersion(lab, { state: 'in_review', files: [{ name: 'other.csv', bytes: `${CSV}150,0.77\n` }] });
    const res = await fileOf(token, other.files[0]!.id);
    expect(res.status).toBe(404);
    expect(await res.text()).toContain('We could not find this dataset version, or you do not have access to it.');
  });

  it('answer 403 with a clear page once the link has expired or been revoked', async () => {
    const expired = await reviewerLink(lab, versionId, false);
    await db()('reviewer_links').where('id', expired.link.linkId).update({ expires_at: new Date(Date.now() - 60_000) });
    const late = await packageOf(expired.token);
    expect(late.status).toBe(403);
    const lateHtml = await late.text();
    expect(lateHtml).toContain('<h1>Review link expired</h1>');
    expect(lateHtml).toContain(LINK_PROBLEM_MESSAGES.expired);

    const revoked = await reviewerLink(lab, versionId, false);
    await db()('reviewer_links').where('id', revoked.link.linkId).update({ revoked_at: new Date() });
    const gone = await fileOf(revoked.token, file.id);
    expect(gone.status).toBe(403);
    expect(await gone.text()).toContain(LINK_PROBLEM_MESSAGES.revoked);
  });
});
