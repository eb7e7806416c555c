import { UploadApiError } from './api-client';
import { retryDelayMs, sleep as defaultSleep, type RetryPolicy, type Sleep } from './backoff';
import type { Limiter } from './limiter';
import type { PartUrl } from './types';
import { isRetryable } from './upload-errors';

export type UploadedPart = { partNumber: number; etag: string | null; sizeBytes: number };

export type UploadPartsOptions = {
  file: Blob;
  partSizeBytes: number;
  /** The parts still to send, each with its presigned URL. */
  parts: PartUrl[];
  putPart: (url: string, body: Blob, signal: AbortSignal) => Promise<string | null>;
  /** Shared by every file on the page, so the browser never has more than its size of parts in flight. */
  limiter: Limiter;
  /** Workers of this file; with a shared limiter of the same size, 3 parts at a time in total. */
  concurrency?: number;
  retry: RetryPolicy;
  signal: AbortSignal;
  sleep?: Sleep;
  /** Fresh URLs for the parts still missing (presigned URLs expire; storage then answers 403). */
  refreshUrls?: () => Promise<PartUrl[]>;
  onPartUploaded?: (part: UploadedPart) => void;
  /** Told before each wait, so the UI can say "connection lost, retrying in 4 s". */
  onRetry?: (info: { partNumber: number; attempt: number; delayMs: number; error: unknown }) => void;
};

/** Byte range [start, end) of a part (1-based), as S3 multipart numbers them. */
export function partRange(partNumber: number, partSizeBytes: number, sizeBytes: number): { start: number; end: number } {
  const start = (partNumber - 1) * partSizeBytes;
  return { start, end: Math.min(start + partSizeBytes, sizeBytes) };
}

/**
 * Sends the given parts, a few at a time, each retried with exponential backoff after a dropped connection,
 * a timeout or a 5xx. One part failing for good stops the others and rejects with that part's error.
 */
export async function uploadParts(opts: UploadPartsOptions): Promise<UploadedPart[]> {
  const sleep = opts.sleep ?? defaultSleep;
  const queue = [...opts.parts].sort((a, b) => a.partNumber - b.partNumber);
  const urls = new Map(queue.map((p) => [p.partNumber, p.url]));
  const done: UploadedPart[] = [];
  const inner = new AbortController();
  const stop = () => inner.abort(opts.signal.reason);
  opts.signal.addEventListener('abort', stop, { once: true });
  let refreshing: Promise<void> | null = null;

  async function refreshOnce(): Promise<void> {
    if (!opts.refreshUrls) return;
    refreshing ??= opts.refreshUrls().then((fresh) => {
      for (const p of fresh) urls.set(p.partNumber, p.url);
    }).finally(() => {
      refreshing = null;
    });
    await refreshing;
  }

  async function sendOne(partNumber: number): Promise<void> {
    const { start, end } = partRange(partNumber, opts.partSizeBytes, opts.file.size);
    for (let attempt = 1; ; attempt += 1) {
      const release = await opts.limiter.acquire(inner.signal);
      try {
        const etag = await opts.putPart(urls.get(partNumber)!, opts.file.slice(start, end), inner.signal);
        const part = { partNumber, etag, sizeBytes: end - start };
        done.push(part);
        opts.onPartUploaded?.(part);
        return;
      } catch (err) {
        if (inner.signal.aborted) throw inner.signal.reason;
        const expired = err instanceof UploadApiError && err.status === 403 && !!opts.refreshUrls;
        if (!(isRetryable(err) || expired) || attempt >= opts.retry.maxAttempts) throw err;
        const delayMs = expired ? 0 : retryDelayMs(attempt, opts.retry);
        opts.onRetry?.({ partNumber, attempt, delayMs, error: err });
        release();
        if (expired) await refreshOnce();
        else await sleep(delayMs, inner.signal);
        continue;
      } finally {
        release();
      }
    }
  }

  async function worker(): Promise<void> {
    for (let next = queue.shift(); next; next = queue.shift()) await sendOne(next.partNumber);
  }

  try {
    const workers = Array.from({ length: Math.min(opts.concurrency ?? 3, queue.length) }, () =>
      worker().catch((err) => {
        inner.abort(err); // one part failed for good: stop the rest
        throw err;
      }),
    );
    const results = await Promise.allSettled(workers);
    const failed = results.find((r): r is PromiseRejectedResult => r.status === 'rejected');
    if (opts.signal.aborted) throw opts.signal.reason;
    if (failed) throw firstRealError(results, failed.reason);
    return done.sort((a, b) => a.partNumber - b.partNumber);
  } finally {
    opts.signal.removeEventListener('abort', stop);
  }
}

/** Workers stopped because a sibling failed reject with that sibling's error (the abort reason); report the cause. */
function firstRealError(results: PromiseSettledResult<void>[], fallback: unknown): unknown {
  const reasons = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected').map((r) => r.reason);
  return reasons.find((r) => r instanceof UploadApiError) ?? fallback;
}
