import { describe, expect, it } from 'vitest';
import { RESUME_KEY } from '@/lib/client/uploads/resume-store';
import { harness, localFile, storedBytes, until } from './helpers';

const KiB = 1024;
const row0 = (h: ReturnType<typeof harness>) => h.manager.getSnapshot()[0];

describe('upload faults and the author-facing messages (fake network)', () => {
  it('refuses an altered upload with both digests named, keeps nothing, and a retry checks and sends again', async () => {
    const h = harness();
    h.server.faults.push({ match: (m, u) => m === 'PUT' && u.includes('partNumber=2&'), kind: 'corrupt', times: 1 });
    const f = localFile('vdp-square.csv', 3 * 64 * KiB, 9);
    h.manager.addFiles([f.file]);
    await until(() => row0(h).phase === 'failed', 'failed');
    expect(row0(h).error).toMatch(new RegExp(`^The file arrived altered: its SHA-256 is [0-9a-f]{64}, but ${f.sha256} was declared\\.`));
    expect(h.server.uploads.size).toBe(0);
    expect(row0(h).fileId).toBeNull();
    expect(h.storage.getItem(RESUME_KEY)).toBeNull();
    h.manager.resume(row0(h).key);
    await until(() => row0(h).phase === 'ready', 'ready after retry');
    expect(h.announced.slice(3).map((m) => m.replace(/: failed: .*/, ': failed'))).toEqual([
      'vdp-square.csv: failed', 'vdp-square.csv: waiting to be checked', 'vdp-square.csv: checking file 0\u00a0%',
      'vdp-square.csv: uploading 0\u00a0% of 192.0 KiB', 'vdp-square.csv: verifying', 'vdp-square.csv: analysing 0\u00a0%', 'vdp-square.csv: ready',
    ]);
    expect(storedBytes(h.server, row0(h).fileId!).equals(Buffer.from(f.bytes))).toBe(true);
  });

  it('when storage stays down at completion: retries, then fails with a clear message; Retry finishes without resending', async () => {
    const h = harness();
    h.server.faults.push({ match: (m, u) => m === 'POST' && u.endsWith('/complete'), kind: '503', times: 4 });
    const f = localFile('hall 2K.csv', 2 * 64 * KiB, 10);
    h.manager.addFiles([f.file]);
    await until(() => row0(h).phase === 'failed', 'failed');
    expect(row0(h).error).toMatch(/^File storage is not answering right now\./);
    expect(h.server.count('POST /api/v1/uploads/f1/complete')).toBe(4);
    expect(h.server.uploads.get('f1')!.state).toBe('pending');
    expect(JSON.parse(h.storage.getItem(RESUME_KEY)!)[0].fileId).toBe('f1');
    const puts = h.server.count('PUT');
    h.manager.resume(row0(h).key);
    await until(() => row0(h).phase === 'ready', 'ready');
    expect(h.server.count('PUT')).toBe(puts);
    expect(row0(h).file?.uploadState).toBe('verified');
  });

  it('when the answer to completion is lost, finds the upload verified instead of completing twice', async () => {
    const h = harness();
    h.server.faults.push({ match: (m, u) => m === 'POST' && u.endsWith('/complete'), kind: 'drop-after', times: 1 });
    const f = localFile('ac-lockin.csv', 2 * 64 * KiB, 19);
    h.manager.addFiles([f.file]);
    await until(() => row0(h).phase === 'ready', 'ready');
    expect(h.server.count('POST /api/v1/uploads/f1/complete')).toBe(1);
    expect(h.server.log).toContain('GET /api/v1/uploads/f1');
    expect(row0(h).file).toMatchObject({ id: 'f1', sha256: f.sha256, uploadState: 'verified' });
    expect(row0(h).error).toBeNull();
  });

  it('when completion says a part never arrived, asks what is missing and sends it once more', async () => {
    const h = harness();
    h.server.faults.push({ match: (m, u) => m === 'PUT' && u.includes('partNumber=3&'), kind: 'lose', times: 1 });
    const f = localFile('lost-part.csv', 4 * 64 * KiB, 20);
    h.manager.addFiles([f.file]);
    await until(() => row0(h).phase === 'ready' || row0(h).phase === 'failed', 'settled');
    expect(row0(h).phase).toBe('ready');
    expect(h.server.count('POST /api/v1/uploads/f1/complete')).toBe(2);
    expect(h.server.log.filter((l) => l.includes('partNumber=3&'))).toHaveLength(2);
    expect(storedBytes(h.server, 'f1').equals(Buffer.from(f.bytes))).toBe(true);
  });

  it('shows the API’s words for 409 and 413 and starts nothing', async () => {
    const h = harness();
    h.server.maxUploadBytes = 100 * KiB;
    const big = localFile('raw-dump.bin', 101 * KiB, 11);
    h.manager.addFiles([big.file]);
    await until(() => row0(h).phase === 'failed', 'failed');
    expect(row0(h).error).toBe(`This file is ${101 * KiB} bytes; the limit per file is ${100 * KiB} bytes.`);

    const other = harness();
    const f = localFile('rrr.csv', 10 * KiB, 12);
    other.manager.addFiles([f.file]);
    await until(() => row0(other).phase === 'ready', 'ready');
    const third = harness(other.server);
    third.manager.addFiles([f.file]); // another tab that does not list it yet
    await until(() => row0(third).phase === 'failed', 'conflict');
    expect(row0(third).error).toBe('A file named “rrr.csv” is already in this version; remove it first.');
    expect(other.manager.addFiles([f.file])).toEqual(['rrr.csv is already in this draft. Remove it first to upload it again.']);
  });

  it('cancel aborts the parts, deletes the server upload and the resume record, and drops the row', async () => {
    const h = harness();
    h.server.putLatencyMs = 15;
    const f = localFile('long-sweep.csv', 30 * 64 * KiB, 13);
    h.manager.addFiles([f.file]);
    await until(() => (h.server.uploads.get('f1')?.parts.size ?? 0) >= 2, 'two parts');
    expect(await h.manager.cancel(row0(h).key)).toBeNull();
    expect(h.manager.getSnapshot()).toEqual([]);
    expect(h.server.uploads.size).toBe(0);
    expect(h.server.log).toContain('DELETE /api/v1/uploads/f1');
    expect(h.storage.getItem(RESUME_KEY)).toBeNull();
    const puts = h.server.count('PUT');
    await new Promise((r) => setTimeout(r, 40));
    expect(h.server.count('PUT')).toBe(puts);
  });

  it('completes through the server’s own part list when storage hides the ETag header, and after URLs expire', async () => {
    const h = harness();
    h.server.exposeEtag = false;
    h.server.putLatencyMs = 5;
    const f = localFile('tc-transition.csv', 8 * 64 * KiB, 14);
    h.manager.addFiles([f.file]);
    await until(() => (h.server.uploads.get('f1')?.parts.size ?? 0) >= 2, 'two parts');
    h.server.expireUrls();
    await until(() => row0(h).phase === 'ready', 'ready');
    expect(h.server.count('GET /api/v1/uploads/f1')).toBe(1); // one refresh of the URLs
    expect(storedBytes(h.server, 'f1').equals(Buffer.from(f.bytes))).toBe(true);
  });

  it('changes the role and removes a verified file through the API', async () => {
    const h = harness();
    const f = localFile('processed-rho.csv', 5 * KiB, 15);
    h.manager.addFiles([f.file]);
    await until(() => row0(h).phase === 'ready', 'ready');
    const before = h.changes();
    const seen: string[][] = [];
    const unwatch = h.manager.watchFiles((files) => seen.push(files.map((f) => `${f.name}:${f.role}`)));
    expect(await h.manager.setRole(row0(h).key, 'processed')).toBeNull();
    expect(row0(h).file?.role).toBe('processed');
    expect(h.server.uploads.get('f1')!.role).toBe('processed');
    expect(await h.manager.remove(row0(h).key)).toBeNull();
    expect(h.manager.getSnapshot()).toEqual([]);
    expect(h.server.uploads.size).toBe(0);
    expect(h.changes() - before).toBe(2);
    expect(seen).toEqual([['processed-rho.csv:processed'], []]);
    unwatch();
    expect(h.announced.at(-1)).toBe('processed-rho.csv: removed');
  });

  it('follows the analysis of a file listed by the server until it is done', async () => {
    const source = harness();
    const f = localFile('seebeck.csv', 5 * KiB, 16);
    source.server.faults.push({ match: (m, u) => m === 'GET' && u.endsWith('/analysis'), kind: 'drop', times: 99 });
    source.manager.addFiles([f.file]);
    await until(() => row0(source).phase === 'analysing' && row0(source).note !== null, 'analysis polling gave up');
    expect(row0(source).note).toBe('Could not ask how the analysis is going (no connection). It goes on on the server; press “Check again”.');
    source.manager.stop();
    source.server.faults = [];
    const page = harness(source.server);
    page.manager.load([source.server.view(source.server.uploads.get('f1')!)]);
    page.manager.start();
    expect(row0(page).phase).toBe('analysing');
    await until(() => row0(page).phase === 'ready', 'ready');
    expect(row0(page).analysisProgress).toBe(1);
    expect(page.changes()).toBe(1);
    source.manager.resume(row0(source).key); // "Check again" on the first page
    await until(() => row0(source).phase === 'ready', 'ready on the first page too');
    expect(row0(source).note).toBeNull();
  });
});
