// Package downloads against the running MariaDB and s3rver: refusals, drafts and review copies never cached, a cancel
// that stops storage reads, a missing object that breaks the stream and is audited, and an anonymous copy with no
// names. The cached copy of published packages (built by the worker, then a 302) is in package-cache-build.test.ts.
import { randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { verifyBag } from '@/lib/bagit/verify-bag';
import { db } from '@/lib/db';
import { downloadPackage } from '@/lib/downloads/download-package';
import { PACKAGE_BUILD_TOPIC } from '@/lib/downloads/package-build-job';
import { listOutboxRows } from '@/lib/outbox/repo';
import { ObjectMissingError, defaultStore, listObjects, objectExists, storeAt, type ObjectStore } from '@/lib/storage/objects';
import { anonymous, collect, downloadLabForFile, identifying, makeVersion, MiB, request, reviewerLink, RXX, saveZip, streamOf, zipEntries, type DownloadLab } from './fixtures';

let lab: DownloadLab;
const scratch = downloadLabForFile('ohm-dl-it-', (made) => (lab = made));
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);


/** A store on its own client that hands every GetObject body it opens to `seen` (to watch their sockets). */
function watchedStore(seen: Readable[]): ObjectStore {
  const store = storeAt(process.env.S3_ENDPOINT!);
  store.client.middlewareStack.add(
    (next) => async (args) => {
      const out = await next(args);
      const body = (out?.output as { Body?: unknown } | undefined)?.Body;
      if (body && typeof (body as Readable).destroy === 'function') seen.push(body as Readable);
      return out;
    },
    { step: 'initialize', name: 'watchBodies' },
  );
  return store;
}

describe('packages that are refused', () => {
  it('refuses the package while embargoed to outsiders, and when withdrawn to the group', async () => {
    const embargoed = await makeVersion(lab, { state: 'published', embargoUntil: inDays(30), files: [{ name: 'a.csv', bytes: RXX }] });
    const refused = await downloadPackage({ versionId: embargoed.versionId, downloader: { kind: 'user', user: lab.outsider }, request: request(), requestId: 'x' }).catch((e: unknown) => e);
    expect(refused).toMatchObject({ status: 403, code: 'embargoed' });
    const withdrawn = await makeVersion(lab, { state: 'withdrawn', files: [{ name: 'b.csv', bytes: RXX }] });
    const gone = await downloadPackage({ versionId: withdrawn.versionId, downloader: { kind: 'user', user: lab.member }, request: request(), requestId: 'x' }).catch((e: unknown) => e);
    expect(gone).toMatchObject({ status: 403, code: 'wrong_state' });
  });
});

describe('packages that are never cached', () => {
  it('builds a draft for its group each time and stores nothing', async () => {
    const draft = await makeVersion(lab, { state: 'draft', files: [{ name: 'draft.csv', bytes: RXX }] });
    const reply = await downloadPackage({ versionId: draft.versionId, downloader: { kind: 'user', user: lab.member }, request: request(), requestId: 'draft' });
    expect(reply).toMatchObject({ status: 200, cacheKey: null });
    expect((await verifyBag(saveZip(scratch, await collect(streamOf(reply))))).valid).toBe(true);
    expect(await listObjects(defaultStore(), `packages/${draft.versionId}/`)).toEqual([]);
    expect(await listOutboxRows(PACKAGE_BUILD_TOPIC, draft.versionId)).toEqual([]);
  });

  it('gives an anonymous reviewer an embargoed package with no creator, affiliation or group name in any entry', async () => {
    const embargoed = await makeVersion(lab, { state: 'published', embargoUntil: inDays(45), files: [{ name: 'rxx.csv', bytes: RXX }] });
    const { link } = await reviewerLink(lab, embargoed.versionId, true);
    const reply = await downloadPackage({ versionId: embargoed.versionId, downloader: { kind: 'reviewer', link }, request: request(), requestId: 'anon' });
    expect(reply).toMatchObject({ status: 200, cacheKey: null });
    const zip = saveZip(scratch, await collect(streamOf(reply)));
    expect((await verifyBag(zip)).valid).toBe(true);
    const entries = await zipEntries(zip);
    expect(entries.length).toBe(10); // 9 tag files (bag-layout.ts) and one payload file
    const leaks = entries.flatMap((e) => identifying(lab).filter((s) => e.bytes.toString('utf8').toLowerCase().includes(s.toLowerCase())).map((s) => `${e.name}: ${s}`));
    expect(leaks).toEqual([]);
    expect(entries.find((e) => e.name.endsWith('/README.md'))!.bytes.toString()).toContain('**Confidential review copy.**');
    expect(await listObjects(defaultStore(), `packages/${embargoed.versionId}/`)).toEqual([]);
    expect(await listOutboxRows(PACKAGE_BUILD_TOPIC, embargoed.versionId)).toEqual([]);
    // Counted in the link's use log only: no user, and the link stands for the session.
    expect(await db()('download_events').where('version_id', embargoed.versionId).select('kind', 'file_id', 'user_id', 'reviewer_link_id'))
      .toEqual([{ kind: 'request', file_id: null, user_id: null, reviewer_link_id: link.linkId }]);
  });
});

describe('faults', () => {
  it('stops reading storage when the client cancels a first download; the cached copy is left to its queued build', async () => {
    const big = await makeVersion(lab, {
      state: 'published',
      files: [{ name: 'sweep-a.bin', bytes: randomBytes(24 * MiB), mediaType: 'application/octet-stream' }, { name: 'sweep-b.bin', bytes: randomBytes(24 * MiB), mediaType: 'application/octet-stream' }],
    });
    const bodies: Readable[] = [];
    const reply = await downloadPackage({ versionId: big.versionId, downloader: anonymous, request: request(), requestId: 'cancel', store: watchedStore(bodies) });
    const reader = streamOf(reply).getReader();
    let received = 0;
    while (received < 2 * MiB || bodies.length === 0) {
      const { value, done } = await reader.read();
      if (done) throw new Error('the package ended before the test could cancel it');
      received += value.length;
    }
    await reader.cancel();
    expect(bodies).toHaveLength(1);
    const socket = (bodies[0] as IncomingMessage).socket;
    expect(bodies[0]!.destroyed).toBe(true);
    const readAtCancel = socket.bytesRead;
    expect(readAtCancel).toBeLessThan(received + 8 * MiB);
    await new Promise((r) => setTimeout(r, 400));
    expect(socket.bytesRead).toBe(readAtCancel);
    expect(bodies).toHaveLength(1);
    expect(await objectExists(defaultStore(), reply.cacheKey!)).toBe(false);
    expect((await listOutboxRows(PACKAGE_BUILD_TOPIC, big.versionId)).map((j) => j.id)).toEqual([reply.buildJobId]);
  });

  it('errors the stream for a missing object, audits package.failed with the request id, and stores nothing', async () => {
    const broken = await makeVersion(lab, {
      state: 'published',
      files: [{ name: 'a-present.csv', bytes: RXX }, { name: 'b-missing.csv', bytes: `never stored ${randomBytes(6).toString('hex')}`, stored: false }],
    });
    const reply = await downloadPackage({ versionId: broken.versionId, downloader: { kind: 'user', user: lab.member }, request: request(), requestId: 'req-pkg-missing-1' });
    const chunks: Uint8Array[] = [];
    const reader = streamOf(reply).getReader();
    const read = (async () => {
      for (let r = await reader.read(); !r.done; r = await reader.read()) chunks.push(r.value);
    })();
    await expect(read).rejects.toThrow(ObjectMissingError);
    // No end-of-central-directory record (PK\x05\x06, APPNOTE 4.3.16): nothing takes the bytes for a whole zip.
    expect(Buffer.concat(chunks).includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]))).toBe(false);
    expect(await objectExists(defaultStore(), reply.cacheKey!)).toBe(false);
    await expect.poll(() => db()('audit_log').where({ action: 'package.failed', target_id: broken.versionId }).count({ n: '*' }).first()).toEqual({ n: 1 });
    const row = await db()('audit_log').where({ action: 'package.failed', target_id: broken.versionId }).first('details', 'actor_kind', 'actor_user_id');
    const details = typeof row.details === 'string' ? JSON.parse(row.details) : row.details;
    expect(details).toMatchObject({ requestId: 'req-pkg-missing-1', error: `object ${broken.files[1]!.storageKey} does not exist` });
    expect(row).toMatchObject({ actor_kind: 'user', actor_user_id: lab.member.id });
  });
});
