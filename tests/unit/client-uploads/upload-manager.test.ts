import { describe, expect, it } from 'vitest';
import { RESUME_KEY } from '@/lib/client/uploads/resume-store';
import { describePhase } from '@/lib/client/uploads/upload-state';
import { harness, localFile, storedBytes, until } from './helpers';

const KiB = 1024;

describe('uploading files through the manager (fake network)', () => {
  it('checks, uploads in parts, verifies and follows the analysis of two files at once', async () => {
    const h = harness();
    const a = localFile('rho-T film A.csv', 700 * KiB + 5, 1);
    const b = localFile('hall-series.bin', 130 * KiB, 2);
    let aHashedWhenBStarted = -1;
    const aSaid: string[] = [];
    h.manager.subscribe(() => {
      const [ra, rb] = h.manager.getSnapshot();
      if (aSaid.at(-1) !== describePhase(ra)) aSaid.push(describePhase(ra));
      if (rb?.phase === 'hashing' && aHashedWhenBStarted < 0) aHashedWhenBStarted = ra.hashedBytes;
    });
    expect(h.manager.addFiles([a.file, b.file])).toEqual([]);
    expect(h.manager.isBusy()).toBe(true);
    await until(() => h.manager.getSnapshot().every((r) => r.phase === 'ready'), 'both ready');
    const [ra, rb] = h.manager.getSnapshot();
    expect(ra.file).toMatchObject({ name: 'rho-T film A.csv', sizeBytes: 700 * KiB + 5, sha256: a.sha256, uploadState: 'verified', analysisState: 'done' });
    expect(rb.file).toMatchObject({ sha256: b.sha256, analysisState: 'none' });
    expect(storedBytes(h.server, ra.fileId!).equals(Buffer.from(a.bytes))).toBe(true);
    expect(h.server.count('PUT http://storage.test/staging/f1')).toBe(11); // ⌈700 KiB / 64 KiB⌉
    expect(h.server.maxInFlightPuts).toBeLessThanOrEqual(3);
    // the second file is checked only once the first is (one hash at a time)
    expect(aHashedWhenBStarted).toBe(700 * KiB + 5);
    expect(h.announced).toContain('rho-T film A.csv: uploading 0\u00a0% of 700.0 KiB');
    expect(aSaid.filter((m) => !/^(checking file|uploading) [1-9]/.test(m))).toEqual([
      'waiting to be checked', 'checking file 0\u00a0%', 'uploading 0\u00a0% of 700.0 KiB', 'verifying', 'analysing 0\u00a0%', 'analysing 40\u00a0%', 'ready',
    ]);
    expect(aSaid).toContain('uploading 45\u00a0% of 700.0 KiB'); // 5 of 11 parts of 64 KiB
    expect(h.changes()).toBe(3); // two verified, one analysed
    expect(h.storage.map.has(RESUME_KEY)).toBe(false);
    expect(h.manager.isBusy()).toBe(false);
  });

  it('pauses mid-upload and resumes sending only the missing parts', async () => {
    const h = harness();
    h.server.putLatencyMs = 10;
    const f = localFile('mr-sweep.csv', 20 * 64 * KiB, 3);
    h.manager.addFiles([f.file]);
    const key = h.manager.getSnapshot()[0].key;
    await until(() => (h.server.uploads.get('f1')?.parts.size ?? 0) >= 4, 'four parts stored');
    h.manager.pause(key);
    expect(h.manager.getSnapshot()[0].phase).toBe('paused');
    await new Promise((r) => setTimeout(r, 40));
    const storedAtPause = h.server.uploads.get('f1')!.parts.size;
    const putsAtPause = h.server.count('PUT');
    expect(storedAtPause).toBeLessThan(20);
    h.manager.resume(key);
    await until(() => (h.server.uploads.get('f1')?.parts.size ?? 0) >= storedAtPause + 3, 'three more parts');
    h.manager.pause(key); // and at once again: the unwinding run must not block the new one
    h.manager.resume(key);
    expect(h.manager.getSnapshot()[0].phase).toBe('uploading');
    await until(() => h.manager.getSnapshot()[0].phase === 'ready', 'ready');
    expect(h.server.count('PUT') - putsAtPause).toBeLessThanOrEqual(20 - storedAtPause + 3); // at most the 3 parts in flight are sent twice
    expect(storedBytes(h.server, 'f1').equals(Buffer.from(f.bytes))).toBe(true);
  });

  it('resumes after a page reload once the same file is picked again, without checking it again', async () => {
    const first = harness();
    first.server.putLatencyMs = 10;
    const f = localFile('cooldown 4K.csv', 12 * 64 * KiB, 4);
    first.manager.addFiles([f.file]);
    await until(() => (first.server.uploads.get('f1')?.parts.size ?? 0) >= 5, 'five parts stored');
    first.manager.stop(); // the tab closes
    await new Promise((r) => setTimeout(r, 30));
    const storedBefore = first.server.uploads.get('f1')!.parts.size;
    expect(JSON.parse(first.storage.getItem(RESUME_KEY)!)).toMatchObject([{ versionId: 'v1', fileId: 'f1', name: 'cooldown 4K.csv', sha256: f.sha256 }]);

    const second = harness(first.server, first.storage); // the page again, same server and localStorage
    second.manager.load([first.server.view(first.server.uploads.get('f1')!)]);
    second.manager.start();
    await until(() => second.manager.getSnapshot()[0]?.uploadedBytes > 0, 'known progress');
    expect(second.manager.getSnapshot()[0].phase).toBe('unfinished');
    expect(second.announced).toEqual([]);
    const putsBefore = first.server.count('PUT');
    expect(second.manager.addFiles([f.file])).toEqual([]);
    await until(() => second.manager.getSnapshot()[0].phase === 'ready', 'ready');
    expect(second.announced.some((m) => m.includes('checking file'))).toBe(false);
    expect(first.server.count('PUT') - putsBefore).toBe(12 - storedBefore);
    expect(storedBytes(first.server, 'f1').equals(Buffer.from(f.bytes))).toBe(true);
    expect(first.storage.getItem(RESUME_KEY)).toBeNull();
  });

  it('after a reload, a picked file that differs from the unfinished one is checked and uploaded afresh', async () => {
    const first = harness();
    const original = localFile('sample.csv', 4 * 64 * KiB, 5);
    first.server.faults.push({ match: (m, u) => m === 'PUT' && u.includes('partNumber=4&'), kind: 'drop', times: 99 });
    first.manager.addFiles([original.file]);
    await until(() => first.manager.getSnapshot()[0].phase === 'failed', 'failed after retries');
    first.server.faults = [];
    const edited = localFile('sample.csv', 4 * 64 * KiB, 6, 1_764_000_999_000); // same name and size, new content
    const second = harness(first.server, first.storage);
    second.manager.load([first.server.view(first.server.uploads.get('f1')!)]);
    second.manager.start();
    second.manager.addFiles([edited.file]);
    await until(() => second.manager.getSnapshot()[0].phase === 'ready', 'ready');
    const row = second.manager.getSnapshot()[0];
    expect(second.announced.slice(0, 2)).toEqual(['sample.csv: waiting to be checked', 'sample.csv: checking file 0\u00a0%']);
    expect(row.file?.sha256).toBe(edited.sha256);
    expect(first.server.uploads.has('f1')).toBe(false); // the old unfinished upload was replaced
    expect(storedBytes(first.server, row.fileId!).equals(Buffer.from(edited.bytes))).toBe(true);
  });

  it('rides out dropped connections with backoff, saying so on the row', async () => {
    const h = harness();
    h.server.faults.push(
      { match: (m, u) => m === 'POST' && u.endsWith('/uploads'), kind: 'drop', times: 1 },
      { match: (m, u) => m === 'PUT' && u.includes('partNumber=2&'), kind: 'drop', times: 2 },
    );
    const notes: string[] = [];
    h.manager.subscribe(() => { const n = h.manager.getSnapshot()[0]?.note; if (n && !notes.includes(n)) notes.push(n); });
    const f = localFile('iv.csv', 3 * 64 * KiB, 8);
    h.manager.addFiles([f.file]);
    await until(() => h.manager.getSnapshot()[0].phase === 'ready', 'ready');
    expect(notes).toEqual(['The server did not answer; trying again in 1 s.', 'Part 2 did not arrive; trying again in 1 s.', 'Part 2 did not arrive; trying again in 2 s.']);
    expect(h.waits).toEqual(expect.arrayContaining([750, 750, 1500]));
  });

  it('on a new visit, forgets records the server no longer holds and refuses the wrong file for an unfinished row', async () => {
    const first = harness();
    first.server.putLatencyMs = 10;
    const kept = localFile('kept.csv', 20 * 64 * KiB, 17);
    const gone = localFile('gone.csv', 20 * 64 * KiB, 18);
    first.manager.addFiles([kept.file, gone.file]);
    await until(() => first.manager.getSnapshot().every((r) => r.phase === 'uploading'), 'both uploading');
    first.manager.stop();
    expect(JSON.parse(first.storage.getItem(RESUME_KEY)!).map((r: { name: string }) => r.name)).toEqual(['kept.csv', 'gone.csv']);
    first.server.uploads.delete('f2'); // cleaned up on the server meanwhile
    const second = harness(first.server, first.storage);
    second.manager.load([first.server.view(first.server.uploads.get('f1')!)]);
    expect(first.storage.getItem(RESUME_KEY)).not.toBeNull(); // load alone touches no storage
    second.manager.start();
    expect(JSON.parse(first.storage.getItem(RESUME_KEY)!).map((r: { name: string }) => r.name)).toEqual(['kept.csv']);
    const key = second.manager.getSnapshot()[0].key;
    expect(second.manager.attach(key, gone.file)).toBe('That is gone.csv (1.25 MiB), not kept.csv (1.25 MiB). Pick the same file to resume.');
    expect(second.manager.getSnapshot()[0].phase).toBe('unfinished');
    expect(second.manager.attach(key, kept.file)).toBeNull();
    await until(() => second.manager.getSnapshot()[0].phase === 'ready', 'ready');
    expect(storedBytes(first.server, 'f1').equals(Buffer.from(kept.bytes))).toBe(true);
  });
});
