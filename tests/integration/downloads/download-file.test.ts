// Single-file downloads against the running MariaDB and s3rver: byte ranges (RFC 9110 §14), access at download time
// (embargo, withdrawal, reviewer links: product.md "Embargo", issue 6), counting, a missing object and a cancel.
import { randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { downloadFile } from '@/lib/downloads/download-file';
import { exactBodyStream } from '@/lib/downloads/web-streams';
import { defaultStore } from '@/lib/storage/objects';
import { openObjectStream } from '@/lib/storage/stream-object';
import { closeDb, collect, dropDownloadLabs, makeDownloadLab, makeVersion, MiB, request, reviewerLink, type DownloadLab, type StoredFile } from './fixtures';

let lab: DownloadLab;
let open: { versionId: string; files: StoredFile[] };
let file: StoredFile;
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
// 1000 bytes of a made-up sweep, so every offset below is known.
const SWEEP = Array.from({ length: 50 }, (_, i) => `${String(300 - i * 5).padStart(3, '0')}.0,${(1.72 - i * 0.03).toFixed(4)}\n`).join('').padEnd(1000, '#');

beforeAll(async () => {
  lab = await makeDownloadLab();
  open = await makeVersion(lab, { state: 'published', files: [{ name: 'ρ(T) "final" sweep.csv', bytes: SWEEP }] });
  file = open.files[0]!;
});
afterAll(async () => {
  await dropDownloadLabs();
  await closeDb();
});

const anonymous = { kind: 'user' as const, user: null };
const asUser = (u: DownloadLab['member']) => ({ kind: 'user' as const, user: u });
const get = (fileId: string, headers: Record<string, string> = {}, downloader: Parameters<typeof downloadFile>[0]['downloader'] = anonymous) =>
  downloadFile({ fileId, downloader, request: request(headers), requestId: `test-${randomBytes(4).toString('hex')}` });
const bodyOf = async (reply: Awaited<ReturnType<typeof downloadFile>>) => collect(reply.body as ReadableStream<Uint8Array>);

/** The refusal a call ends in (fails the test if it succeeds). */
async function refusal(promise: Promise<unknown>): Promise<{ status?: number; code?: string; message: string }> {
  const outcome = await promise.then(() => null, (e: unknown) => e as { status?: number; code?: string; message: string });
  if (!outcome) throw new Error('expected a refusal, but the download was allowed');
  return outcome;
}

describe('byte ranges', () => {
  it('answers the whole file with its SHA-256 as ETag, Accept-Ranges and an RFC 6266/8187 filename', async () => {
    const reply = await get(file.id);
    expect(reply.status).toBe(200);
    expect(reply.headers).toMatchObject({
      etag: `"${file.sha256}"`, 'accept-ranges': 'bytes', 'content-length': '1000', 'content-type': 'text/csv',
      // '"' becomes "_" as in the zip's names (Windows forbids it); "ρ" is U+03C1 = UTF-8 CF 81; "(", ")" and space
      // are not attr-chars (RFC 8187 §3.2.1); the ASCII fallback has "_" for "ρ".
      'content-disposition': `attachment; filename="_(T) _final_ sweep.csv"; filename*=UTF-8''%CF%81%28T%29%20_final_%20sweep.csv`,
      'cache-control': 'public, max-age=0, must-revalidate, no-transform',
    });
    expect((await bodyOf(reply)).equals(file.bytes)).toBe(true);
  });

  it.each([
    ['bytes=0-9', 0, 9],
    ['bytes=0-0', 0, 0], // s3rver 3.7.1 reads a last position of 0 as "to the end"; the download still sends one byte
    ['bytes=990-', 990, 999],
    ['bytes=-7', 993, 999],
    ['bytes=-5000', 0, 999], // a suffix longer than the file is the whole file (RFC 9110 §14.1.1)
    ['bytes=500-123456', 500, 999], // last position clamped to the end
    ['BYTES=10-19', 10, 19], // the range unit is case-insensitive (RFC 9110 §14.1)
  ])('%s → 206 with bytes %i–%i exactly', async (range, start, end) => {
    const reply = await get(file.id, { range });
    expect(reply.status).toBe(206);
    expect(reply.headers['content-range']).toBe(`bytes ${start}-${end}/1000`);
    expect(reply.headers['content-length']).toBe(String(end - start + 1));
    expect((await bodyOf(reply)).equals(file.bytes.subarray(start, end + 1))).toBe(true);
  });

  it.each(['bytes=1000-', 'bytes=1000-2000', 'bytes=-0'])('%s → 416 with Content-Range bytes */1000', async (range) => {
    const reply = await get(file.id, { range });
    expect(reply.status).toBe(416);
    expect(reply.headers['content-range']).toBe('bytes */1000');
    expect(reply.body).toBe('The requested range is not satisfiable: this file has 1000 bytes.\n');
  });

  it.each(['bytes=0-1,5-6', 'bytes=20-10', 'bytes=abc', 'items=0-5'])('%s (several, invalid or another unit) → 200 with the whole file', async (range) => {
    const reply = await get(file.id, { range });
    expect(reply.status).toBe(200);
    expect(reply.headers['content-range']).toBeUndefined();
    expect((await bodyOf(reply)).equals(file.bytes)).toBe(true);
  });

  it('honours If-Range only with the current ETag, and answers If-None-Match with 304', async () => {
    expect((await get(file.id, { range: 'bytes=0-3', 'if-range': `"${file.sha256}"` })).status).toBe(206);
    const stale = await get(file.id, { range: 'bytes=0-3', 'if-range': `"${'0'.repeat(64)}"` });
    expect(stale.status).toBe(200);
    await bodyOf(stale);
    const cached = await get(file.id, { 'if-none-match': `W/"x", "${file.sha256}"` });
    expect(cached).toMatchObject({ status: 304, body: null });
  });

  it('counts the whole file and a range from byte 0 as requests, not later segments or HEAD', async () => {
    const counted = await makeVersion(lab, { state: 'published', files: [{ name: 'count.csv', bytes: SWEEP.replace('300', '299') }] });
    const id = counted.files[0]!.id;
    const viewer = (n: number) => ({ 'user-agent': `Mozilla/5.0 (X11; Linux x86_64) DownloadProbe/${n}`, 'x-forwarded-for': `198.51.100.${n}` });
    await bodyOf(await get(id, viewer(1)));
    await bodyOf(await get(id, { ...viewer(2), range: 'bytes=0-99' }));
    await bodyOf(await get(id, { ...viewer(2), range: 'bytes=100-' }));
    expect((await downloadFile({ fileId: id, downloader: anonymous, request: request(viewer(3), 'HEAD'), requestId: 'head' })).body).toBeNull();
    const rows = await db()('download_events').where('version_id', counted.versionId).orderBy('id').select('kind', 'file_id', 'user_id', 'counted');
    expect(rows.map((r: { kind: string; file_id: string; user_id: string | null; counted: number }) => [r.kind, r.file_id, r.user_id, Boolean(r.counted)]))
      .toEqual([['request', id, null, true], ['request', id, null, true]]);
  });
});

describe('access at download time', () => {
  let embargoed: { versionId: string; files: StoredFile[] };
  beforeAll(async () => {
    embargoed = await makeVersion(lab, { state: 'published', embargoUntil: inDays(60), files: [{ name: 'locked.csv', bytes: '300.0,1.72\n' }] });
  });

  it('refuses an embargoed file to anonymous visitors and signed-in outsiders (403 embargoed)', async () => {
    const id = embargoed.files[0]!.id;
    for (const downloader of [anonymous, asUser(lab.outsider)]) {
      const e = await refusal(get(id, {}, downloader));
      expect(e).toMatchObject({ status: 403, code: 'embargoed' });
      expect(e.message).toBe(`The files of this version are under embargo until ${inDays(60)} at 00:00 UTC.`);
    }
  });

  it('gives an embargoed file to the group and to a valid reviewer link, counted through the link only', async () => {
    const id = embargoed.files[0]!.id;
    const member = await get(id, {}, asUser(lab.member));
    expect(member.headers['cache-control']).toBe('private, no-store, no-transform');
    expect((await bodyOf(member)).toString()).toBe('300.0,1.72\n');
    const { link } = await reviewerLink(lab, embargoed.versionId, true);
    const reviewer = await get(id, { 'user-agent': 'Mozilla/5.0 ReviewerProbe/2' }, { kind: 'reviewer', link });
    expect((await bodyOf(reviewer)).toString()).toBe('300.0,1.72\n');
    const viaLink = await db()('download_events').where('reviewer_link_id', link.linkId).select('kind', 'file_id', 'user_id');
    expect(viaLink).toEqual([{ kind: 'request', file_id: id, user_id: null }]);
  });

  it('answers 404 for a reviewer link of another version, and for a draft seen from outside the group', async () => {
    const { link } = await reviewerLink(lab, embargoed.versionId, false);
    expect(await refusal(get(file.id, {}, { kind: 'reviewer', link }))).toMatchObject({ status: 404, code: 'not_found' });
    const draft = await makeVersion(lab, { state: 'draft', files: [{ name: 'draft.csv', bytes: 'T,R\n' }] });
    expect(await refusal(get(draft.files[0]!.id, {}, asUser(lab.outsider)))).toMatchObject({ status: 404, code: 'not_found' });
    expect(await refusal(get('not-a-uuid'))).toMatchObject({ status: 404, code: 'not_found' });
  });

  it('refuses the files of a withdrawn version, to its own group too (wrong_state)', async () => {
    const withdrawn = await makeVersion(lab, { state: 'withdrawn', files: [{ name: 'gone.csv', bytes: 'T,R\n1,2\n' }] });
    const id = withdrawn.files[0]!.id;
    for (const downloader of [anonymous, asUser(lab.member), asUser(lab.owner)]) {
      expect(await refusal(get(id, {}, downloader))).toMatchObject({ status: 403, code: 'wrong_state' });
    }
  });
});

describe('faults', () => {
  it('answers 500 for an object missing from storage, logs it and audits file.download_failed with the request id', async () => {
    const broken = await makeVersion(lab, { state: 'published', files: [{ name: 'lost.csv', bytes: `lost ${randomBytes(8).toString('hex')}`, stored: false }] });
    const id = broken.files[0]!.id;
    const e = await refusal(downloadFile({ fileId: id, downloader: anonymous, request: request(), requestId: 'req-lost-file-1' }));
    expect(e).toMatchObject({ status: 500, code: 'internal', message: "This file's stored copy could not be read. The site admin has been told; please try again later." });
    const audit = await db()('audit_log').where({ action: 'file.download_failed', target_id: broken.versionId }).select('details', 'actor_kind');
    expect(audit).toHaveLength(1);
    const details = typeof audit[0].details === 'string' ? JSON.parse(audit[0].details) : audit[0].details;
    expect(details).toMatchObject({ requestId: 'req-lost-file-1', fileId: id, error: `object ${broken.files[0]!.storageKey} does not exist` });
    expect(audit[0].actor_kind).toBe('anonymous');
    expect(await db()('download_events').where('version_id', broken.versionId).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('stops reading from storage when the client cancels mid-file', async () => {
    const big = await makeVersion(lab, { state: 'published', files: [{ name: 'big.bin', bytes: randomBytes(24 * MiB), mediaType: 'application/octet-stream' }] });
    const object = await openObjectStream(defaultStore(), big.files[0]!.storageKey);
    const socket = (object.body as IncomingMessage).socket;
    const reader = exactBodyStream(object.body, object.sizeBytes).getReader();
    let received = 0;
    while (received < MiB) received += (await reader.read()).value!.length;
    await reader.cancel();
    expect(object.body.destroyed).toBe(true);
    const readAtCancel = socket.bytesRead;
    expect(readAtCancel).toBeLessThan(received + 8 * MiB); // pulled, not read ahead to the end of 24 MiB
    await new Promise((r) => setTimeout(r, 300));
    expect(socket.bytesRead).toBe(readAtCancel);
  });
});
