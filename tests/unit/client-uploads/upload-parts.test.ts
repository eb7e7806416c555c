import { File } from 'node:buffer';
import { describe, expect, it } from 'vitest';
import { createUploadApi } from '@/lib/client/uploads/api-client';
import type { RetryPolicy } from '@/lib/client/uploads/backoff';
import { createLimiter } from '@/lib/client/uploads/limiter';
import { partRange, uploadParts } from '@/lib/client/uploads/upload-parts';
import { FakeUploadServer, patternBytes } from './fake-upload-server';

const RETRY: RetryPolicy = { maxAttempts: 4, baseDelayMs: 1000, maxDelayMs: 30_000, random: () => 0.5 };
const SHA = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';

async function setup(sizeBytes: number) {
  const server = new FakeUploadServer();
  const api = createUploadApi({ fetch: server.fetch });
  const bytes = patternBytes(sizeBytes);
  const file = new File([bytes], 'iv-curve.dat') as unknown as Blob;
  const begun = await api.beginUpload('v1', { name: 'iv-curve.dat', sizeBytes, sha256: SHA });
  const waits: number[] = [];
  const base = {
    file, partSizeBytes: begun.partSizeBytes, parts: begun.parts, putPart: api.putPart, limiter: createLimiter(3), retry: RETRY,
    signal: new AbortController().signal, sleep: async (ms: number) => void waits.push(ms),
  };
  return { server, api, bytes, begun, waits, base, stored: () => Buffer.concat([...server.uploads.get(begun.fileId)!.parts].sort((a, b) => a[0] - b[0]).map(([, p]) => p.bytes)) };
}

describe('part scheduling', () => {
  it('cuts a file into S3 part ranges', () => {
    expect(partRange(1, 100, 250)).toEqual({ start: 0, end: 100 });
    expect(partRange(3, 100, 250)).toEqual({ start: 200, end: 250 });
  });

  it('sends every part, never more than 3 at a time, and stores the exact bytes', async () => {
    const { server, begun, base, bytes, stored } = await setup(10 * 64 * 1024 + 123);
    server.putLatencyMs = 5;
    const uploaded: number[] = [];
    const parts = await uploadParts({ ...base, onPartUploaded: (p) => uploaded.push(p.sizeBytes) });
    expect(begun.partCount).toBe(11);
    expect(parts.map((p) => p.partNumber)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
    expect(parts.every((p) => /^"[0-9a-f]{32}"$/.test(p.etag!))).toBe(true);
    expect(uploaded.reduce((a, b) => a + b, 0)).toBe(bytes.length);
    expect(server.maxInFlightPuts).toBe(3);
    expect(stored().equals(Buffer.from(bytes))).toBe(true);
  });

  it('retries a dropped connection and a 503 with growing waits, and a lost answer by sending again', async () => {
    const { server, base, bytes, waits, stored } = await setup(3 * 64 * 1024);
    server.faults.push(
      { match: (m, u) => m === 'PUT' && u.includes('partNumber=2&'), kind: 'drop', times: 2 },
      { match: (m, u) => m === 'PUT' && u.includes('partNumber=3&'), kind: '503', times: 1 },
      { match: (m, u) => m === 'PUT' && u.includes('partNumber=1&'), kind: 'drop-after', times: 1 },
    );
    const notes: string[] = [];
    const parts = await uploadParts({ ...base, onRetry: ({ partNumber, attempt, delayMs }) => notes.push(`${partNumber}:${attempt}:${delayMs}`) });
    expect(parts).toHaveLength(3);
    expect(notes.sort()).toEqual(['1:1:750', '2:1:750', '2:2:1500', '3:1:750']);
    expect(waits.sort((a, b) => a - b)).toEqual([750, 750, 750, 1500]);
    expect(server.count('PUT')).toBe(7);
    expect(stored().equals(Buffer.from(bytes))).toBe(true);
  });

  it('gives up after maxAttempts and stops the other parts', async () => {
    const { server, base } = await setup(6 * 64 * 1024);
    server.faults.push({ match: (m, u) => m === 'PUT' && u.includes('partNumber=1&'), kind: 'drop', times: 99 });
    server.putLatencyMs = 20;
    await expect(uploadParts(base)).rejects.toMatchObject({ status: 0, code: 'network' });
    expect(server.log.filter((l) => l.includes('partNumber=1&'))).toHaveLength(4);
    expect(server.uploads.get('f1')!.parts.size).toBeLessThan(6);
  });

  it('fetches fresh URLs once when storage says the presigned ones expired', async () => {
    const { server, api, base, begun, bytes, stored } = await setup(4 * 64 * 1024);
    server.expireUrls();
    let refreshes = 0;
    const parts = await uploadParts({ ...base, refreshUrls: async () => { refreshes += 1; return (await api.getUploadStatus(begun.fileId)).parts; } });
    expect(parts).toHaveLength(4);
    expect(refreshes).toBe(1);
    expect(stored().equals(Buffer.from(bytes))).toBe(true);
  });

  it('stops at once when paused, rejecting with the pause reason', async () => {
    const { server, base } = await setup(9 * 64 * 1024);
    server.putLatencyMs = 30;
    const pause = new AbortController();
    setTimeout(() => pause.abort('paused'), 40);
    await expect(uploadParts({ ...base, signal: pause.signal })).rejects.toBe('paused');
    const after = server.count('PUT');
    await new Promise((r) => setTimeout(r, 80));
    expect(server.count('PUT')).toBe(after);
    expect(server.uploads.get('f1')!.parts.size).toBeLessThan(9);
  });
});
