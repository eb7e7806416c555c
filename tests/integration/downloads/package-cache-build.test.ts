// The cached copy of a published package, against the running MariaDB and s3rver: the first download streams and
// queues one outbox build job (one per cache key, however many downloads come first); the worker's handler builds the
// copy, a valid bag (lib/bagit verifyBag) byte for byte what the first client got; the next download gets 302 to it.
// A build that fails part-way leaves nothing under the key, downloads keep streaming, and the outbox retries it, up to
// MAX_BUILD_TRIES tries. A stopped build reads storage no further.
import { createHash, randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { verifyBag } from '@/lib/bagit/verify-bag';
import { db } from '@/lib/db';
import { buildPackageIntoCache } from '@/lib/downloads/build-cached-package';
import { downloadPackage } from '@/lib/downloads/download-package';
import { loadPackageInput } from '@/lib/downloads/load-package-input';
import { buildHoldMs, MAX_BUILD_TRIES, packageOutboxHandlers, PACKAGE_BUILD_TOPIC, runPackageBuild } from '@/lib/downloads/package-build-job';
import { PACKAGE_URL_TTL_S } from '@/lib/downloads/package-cache';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { processOutboxOnce, tryOutboxJobNow } from '@/lib/outbox/process-outbox';
import { findOutboxRow, listOutboxRows } from '@/lib/outbox/repo';
import { defaultStore, deleteObjects, listObjects, objectExists, readObject, storeAt, type ObjectStore } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { anonymous, collect, downloadLabForFile, makeVersion, MiB, request, RXX, saveZip, streamOf, zipEntries, type DownloadLab, type StoredFile } from './fixtures';

let lab: DownloadLab;
const scratch = downloadLabForFile('ohm-cache-it-', (made) => (lab = made));
const sha256Hex = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');


async function storedBytes(key: string): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  for await (const c of (await readObject(defaultStore(), key)).body) chunks.push(c);
  return Buffer.concat(chunks);
}

/** The waiting build jobs of a version, as the outbox holds them. */
const buildJobs = (versionId: string) => listOutboxRows(PACKAGE_BUILD_TOPIC, versionId);

/** A zip's manifest-sha256.txt as { path: digest }. */
async function manifestOf(zip: string): Promise<Record<string, string>> {
  const manifest = (await zipEntries(zip)).find((e) => e.name.endsWith('/manifest-sha256.txt'))!.bytes.toString('utf8');
  return Object.fromEntries(manifest.trim().split('\n').map((line) => line.split('  ').reverse() as [string, string]));
}

describe('the cached copy of a published package', () => {
  let versionId: string;
  let files: StoredFile[];
  let first: Buffer;
  let jobId: number;
  let cacheKey: string;

  it('streams the first download and queues exactly one build, held back while that download runs', async () => {
    const made = await makeVersion(lab, {
      state: 'published',
      files: [{ name: 'rxx_1p8K.csv', bytes: RXX }, { name: 'lockin-raw.bin', bytes: randomBytes(9 * MiB + 11), mediaType: 'application/octet-stream' }],
    });
    ({ versionId, files } = made);
    const reply = await downloadPackage({ versionId, downloader: anonymous, request: request(), requestId: 'cache-first' });
    expect(reply.status).toBe(200);
    expect(reply.headers['content-type']).toBe('application/zip');
    expect(reply.cacheKey).toMatch(new RegExp(`^packages/${versionId}/[0-9a-f]{64}\\.zip$`));
    cacheKey = reply.cacheKey!;
    first = await collect(streamOf(reply));
    const report = await verifyBag(saveZip(scratch, first));
    expect(report.problems).toEqual([]);
    expect(report).toMatchObject({ valid: true, payloadFiles: 2, payloadBytes: RXX.length + 9 * MiB + 11 });

    const jobs = await buildJobs(versionId);
    expect(jobs).toHaveLength(1);
    jobId = jobs[0]!.id;
    expect(reply.buildJobId).toBe(jobId);
    expect(jobs[0]).toMatchObject({ attempts: 0, processedAt: null, lastError: null });
    expect(jobs[0]!.payload).toEqual({ versionId, cacheKey, compression: 'store', baggingDate: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) });
    // Held back by buildHoldMs (30 s and more), so no worker reads the same objects while the first client does.
    expect(jobs[0]!.nextAttemptAt!.getTime()).toBeGreaterThan(Date.now() + 20_000);
    expect(buildHoldMs(0)).toBe(30_000);
    expect(await objectExists(defaultStore(), cacheKey)).toBe(false);
  });

  it('still streams while the copy is not built, and queues no second job, even for two downloads at once', async () => {
    const replies = await Promise.all([1, 2].map((n) =>
      downloadPackage({ versionId, downloader: { kind: 'user', user: lab.outsider }, request: request(), requestId: `cache-again-${n}` })));
    for (const reply of replies) {
      expect(reply).toMatchObject({ status: 200, cacheKey, buildJobId: jobId });
      expect((await verifyBag(saveZip(scratch, await collect(streamOf(reply))))).valid).toBe(true);
    }
    expect((await buildJobs(versionId)).map((j) => j.id)).toEqual([jobId]);
  });

  it('is built by the worker\'s job: a valid bag, byte for byte the first download, with the files\' digests', async () => {
    expect(await tryOutboxJobNow(jobId, packageOutboxHandlers())).toBe('done');
    expect(await findOutboxRow(jobId)).toMatchObject({ attempts: 1, processedAt: expect.any(Date), lastError: null });
    const cached = await storedBytes(cacheKey);
    const zip = saveZip(scratch, cached);
    const report = await verifyBag(zip);
    expect(report.problems).toEqual([]);
    expect(report).toMatchObject({ valid: true, payloadFiles: 2, payloadBytes: RXX.length + 9 * MiB + 11, algorithms: ['sha256'] });
    // The manifest lists the digests the database holds, and the payload in the zip has exactly those digests.
    const expected = Object.fromEntries(files.map((f) => [`data/${f.name}`, f.sha256]));
    expect(await manifestOf(zip)).toEqual(expected);
    const payload = (await zipEntries(zip)).filter((e) => e.name.includes('/data/'));
    expect(Object.fromEntries(payload.map((e) => [e.name.slice(e.name.indexOf('/') + 1), sha256Hex(e.bytes)]))).toEqual(expected);
    // Built with the first download's bagging date: the same bytes that client got.
    expect(cached.equals(first)).toBe(true);
  });

  it('answers the next download with 302 to a presigned GET of the same bytes, and builds nothing twice', async () => {
    const reply = await downloadPackage({ versionId, downloader: { kind: 'user', user: lab.outsider }, request: request(), requestId: 'cache-302' });
    expect(reply.status).toBe(302);
    expect(reply.body).toBeNull();
    expect(reply.buildJobId).toBeUndefined();
    const url = new URL(reply.headers.location!);
    expect(url.searchParams.get('X-Amz-Expires')).toBe(String(PACKAGE_URL_TTL_S));
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="ohmstead-ohm\.d[0-9a-f]{8}\.zip"/);
    expect(Buffer.from(await res.arrayBuffer()).equals(first)).toBe(true);
    expect((await buildJobs(versionId)).map((j) => j.id)).toEqual([jobId]);
    // A job for a key that is filled already does nothing (e.g. a second job queued just before the first finished).
    const job = (await findOutboxRow(jobId))!;
    expect(await runPackageBuild(job.payload, job)).toBe('already_cached');
    // Every download counted as one COUNTER request for the whole package (file_id null): 1 + 2 streamed, 1 redirected.
    expect(await db()('download_events').where({ version_id: versionId, file_id: null }).count({ n: '*' }).first()).toEqual({ n: 4 });
  });
});

describe('a cache build that fails', () => {
  it('leaves nothing under the key; downloads still stream whole packages; the outbox retries the build', async () => {
    // The first payload file spans more than one 8 MiB part, so part of the zip is uploaded before the build fails.
    const made = await makeVersion(lab, {
      state: 'published',
      files: [{ name: 'a-sweep.bin', bytes: randomBytes(12 * MiB), mediaType: 'application/octet-stream' }, { name: 'b-rxx.csv', bytes: `${RXX}# run ${randomBytes(4).toString('hex')}\n` }],
    });
    const download = async (requestId: string) => {
      const reply = await downloadPackage({ versionId: made.versionId, downloader: anonymous, request: request(), requestId });
      expect(reply.status).toBe(200);
      const report = await verifyBag(saveZip(scratch, await collect(streamOf(reply))));
      expect(report).toMatchObject({ valid: true, payloadFiles: 2 });
      return reply;
    };
    const reply = await download('failing-build-1');
    const key = reply.cacheKey!;
    const late = made.files[1]!;

    // The second file disappears from storage after the first download had it: the build breaks off after the first.
    await deleteObjects(defaultStore(), [late.storageKey]);
    expect(await tryOutboxJobNow(reply.buildJobId!, packageOutboxHandlers())).toBe('failed');
    const failed = (await findOutboxRow(reply.buildJobId!))!;
    expect(failed).toMatchObject({ attempts: 1, processedAt: null, lastError: `object ${late.storageKey} does not exist` });
    expect(failed.nextAttemptAt!.getTime()).toBeGreaterThan(Date.now()); // retried after the outbox's backoff
    expect(await objectExists(defaultStore(), key)).toBe(false);
    expect(await listObjects(defaultStore(), `packages/${made.versionId}/`)).toEqual([]);

    // The file is back: downloads stream whole packages meanwhile, and the waiting job is not queued a second time.
    await putObject(defaultStore(), late.storageKey, late.bytes);
    const again = await download('failing-build-2');
    expect(again.buildJobId).toBe(reply.buildJobId);
    expect((await listOutboxRows(PACKAGE_BUILD_TOPIC, made.versionId)).map((j) => j.id)).toEqual([reply.buildJobId]);

    // Once due (as after the backoff), the outbox retries it: here, or the stack's worker if it comes first.
    await db()('outbox').where('id', reply.buildJobId!).update({ next_attempt_at: null });
    await expect.poll(async () => {
      await processOutboxOnce(packageOutboxHandlers(), { limit: 10 });
      return (await findOutboxRow(reply.buildJobId!))?.processedAt ?? null;
    }, { timeout: 60_000, interval: 500 }).toBeInstanceOf(Date);
    expect(await objectExists(defaultStore(), key)).toBe(true);
    expect((await downloadPackage({ versionId: made.versionId, downloader: anonymous, request: request(), requestId: 'failing-build-3' })).status).toBe(302);
  }, 90_000);
});

describe('a cache build that keeps failing', () => {
  it('is closed after MAX_BUILD_TRIES tries with the reason kept, and the next download queues a new build', async () => {
    const made = await makeVersion(lab, { state: 'published', files: [{ name: 'rxx.csv', bytes: `${RXX}# run ${randomBytes(4).toString('hex')}\n` }] });
    const download = () => downloadPackage({ versionId: made.versionId, downloader: anonymous, request: request(), requestId: 'given-up' });
    const first = await download();
    await collect(streamOf(first));
    const file = made.files[0]!;
    await deleteObjects(defaultStore(), [file.storageKey]); // every build now fails
    const jobId = first.buildJobId!;
    const handlers = packageOutboxHandlers();

    // Each try is run here, or by the stack's worker if it comes first: wait for the row to show the try's outcome.
    const tryUntil = async (done: (row: Awaited<ReturnType<typeof findOutboxRow>>) => boolean) => {
      await expect.poll(async () => {
        await processOutboxOnce(handlers, { limit: 50 });
        return done(await findOutboxRow(jobId));
      }, { timeout: 30_000, interval: 300 }).toBe(true);
    };
    // One try short of the limit: still scheduled again.
    await db()('outbox').where('id', jobId).update({ attempts: MAX_BUILD_TRIES - 2, next_attempt_at: null, last_error: null });
    await tryUntil((row) => row?.lastError != null);
    expect(await findOutboxRow(jobId)).toMatchObject({ attempts: MAX_BUILD_TRIES - 1, processedAt: null, lastError: `object ${file.storageKey} does not exist` });
    // The last try: closed, with why.
    await db()('outbox').where('id', jobId).update({ next_attempt_at: null });
    await tryUntil((row) => row?.processedAt != null);
    const closed = (await findOutboxRow(jobId))!;
    expect(closed).toMatchObject({ attempts: MAX_BUILD_TRIES, processedAt: expect.any(Date), nextAttemptAt: null });
    expect(closed.lastError).toBe(`given up after ${MAX_BUILD_TRIES} tries; the next download queues a new build. Last error: object ${file.storageKey} does not exist`);
    expect(await objectExists(defaultStore(), first.cacheKey!)).toBe(false);

    // The file is back: the next download streams and queues a fresh build.
    await putObject(defaultStore(), file.storageKey, file.bytes);
    const next = await download();
    expect(next.status).toBe(200);
    await collect(streamOf(next));
    expect(next.buildJobId).toBeDefined();
    expect(next.buildJobId).not.toBe(jobId);
  }, 60_000);
});

describe('a cache build whose worker stops', () => {
  it('gives the job back untried, due at once, instead of counting a failed try', async () => {
    const made = await makeVersion(lab, { state: 'published', files: [{ name: 'rxx.csv', bytes: `${RXX}# run ${randomBytes(4).toString('hex')}\n` }] });
    const first = await downloadPackage({ versionId: made.versionId, downloader: anonymous, request: request(), requestId: 'worker-stops' });
    await collect(streamOf(first));
    const stopped = new AbortController();
    stopped.abort(); // the worker is stopping while this build runs
    // The fresh job is held back from workers, so this process takes the first try.
    expect(await tryOutboxJobNow(first.buildJobId!, packageOutboxHandlers({ signal: stopped.signal }))).toBe('failed');
    expect(await findOutboxRow(first.buildJobId!)).toMatchObject({ attempts: 0, processedAt: null, nextAttemptAt: null, lastError: null });
    expect(await objectExists(defaultStore(), first.cacheKey!)).toBe(false);
  }, 30_000);
});

describe('a cache build that is stopped', () => {
  it('stops reading storage at once and stores nothing', async () => {
    const made = await makeVersion(lab, {
      state: 'published',
      files: [{ name: 'sweep-a.bin', bytes: randomBytes(24 * MiB), mediaType: 'application/octet-stream' }, { name: 'sweep-b.bin', bytes: randomBytes(24 * MiB), mediaType: 'application/octet-stream' }],
    });
    const version = (await findVersionRow(made.versionId))!;
    const input = await loadPackageInput({ version }, anonymous, new Date());
    const bodies: Readable[] = [];
    const store: ObjectStore = storeAt(process.env.S3_ENDPOINT!);
    store.client.middlewareStack.add(
      (next) => async (args) => {
        const out = await next(args);
        const body = (out?.output as { Body?: unknown } | undefined)?.Body;
        if (body && typeof (body as Readable).destroy === 'function') bodies.push(body as Readable);
        return out;
      },
      { step: 'initialize', name: 'watchBodies' },
    );
    const key = `packages/${made.versionId}/stopped-${randomBytes(4).toString('hex')}.zip`;
    const stop = new AbortController();
    const build = buildPackageIntoCache({ input, store, key, signal: stop.signal });
    await expect.poll(() => (bodies[0] as IncomingMessage | undefined)?.socket?.bytesRead ?? 0, { timeout: 20_000, interval: 20 }).toBeGreaterThan(2 * MiB);
    stop.abort();
    await expect(build).rejects.toThrow(/aborted/i);
    expect(bodies).toHaveLength(1);
    expect(bodies[0]!.destroyed).toBe(true);
    const socket = (bodies[0] as IncomingMessage).socket;
    const readAtStop = socket.bytesRead;
    await new Promise((r) => setTimeout(r, 400));
    expect(socket.bytesRead).toBe(readAtStop);
    expect(bodies).toHaveLength(1);
    expect(await objectExists(defaultStore(), key)).toBe(false);
  }, 60_000);
});
