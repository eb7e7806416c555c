import { createHash } from 'node:crypto';
import { File } from 'node:buffer';
import { createUploadApi } from '@/lib/client/uploads/api-client';
import { sleep, type RetryPolicy } from '@/lib/client/uploads/backoff';
import { createResumeStore } from '@/lib/client/uploads/resume-store';
import type { LocalFile } from '@/lib/client/uploads/types';
import { createUploadManager } from '@/lib/client/uploads/upload-manager';
import { FakeUploadServer, MemoryStorage, patternBytes } from './fake-upload-server';

export const RETRY: RetryPolicy = { maxAttempts: 4, baseDelayMs: 1000, maxDelayMs: 30_000, random: () => 0.5 };

export function localFile(name: string, sizeBytes: number, seed = 7, lastModified = 1_764_000_000_000) {
  const bytes = patternBytes(sizeBytes, seed);
  return { file: new File([bytes], name, { lastModified, type: 'text/csv' }) as unknown as LocalFile, bytes, sha256: createHash('sha256').update(bytes).digest('hex') };
}

/** A manager wired to the fake network; waits are recorded and skipped so tests run fast. */
export function harness(server = new FakeUploadServer(), storage = new MemoryStorage()) {
  const waits: number[] = [];
  const announced: string[] = [];
  let changes = 0;
  const manager = createUploadManager({
    versionId: 'v1',
    api: createUploadApi({ fetch: server.fetch }),
    store: createResumeStore(storage),
    retry: RETRY,
    sleep: (ms, signal) => { waits.push(ms); return sleep(0, signal); },
    pollIntervalMs: 1,
    hashChunkBytes: 16 * 1024,
    onFilesChanged: () => { changes += 1; },
    announce: (m) => announced.push(m),
  });
  return { server, storage, manager, waits, announced, changes: () => changes };
}

export async function until(check: () => boolean, what: string, timeoutMs = 5000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!check()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 2));
  }
}

export function storedBytes(server: FakeUploadServer, fileId: string): Buffer {
  return Buffer.concat([...server.uploads.get(fileId)!.parts].sort((a, b) => a[0] - b[0]).map(([, p]) => p.bytes));
}
