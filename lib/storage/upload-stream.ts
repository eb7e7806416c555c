import 'server-only';
import { once } from 'node:events';
import { PassThrough } from 'node:stream';
import { Upload } from '@aws-sdk/lib-storage';
import { storageFailure, type ObjectStore } from './objects';

const MiB = 1024 * 1024;

export type StreamUploadOutcome = { stored: true } | { stored: false; reason: 'aborted' | 'failed'; error?: Error };

/** An object written chunk by chunk while its bytes are produced; it becomes visible only when finish() succeeds. */
export type StreamUpload = {
  /** Hands one chunk on; resolves once more may be written. false: the upload is over (failed or aborted), stop writing. */
  write(chunk: Uint8Array): Promise<boolean>;
  /** No more chunks: resolves with the outcome once the object is stored (or the upload failed). */
  finish(): Promise<StreamUploadOutcome>;
  /** Drops the upload: nothing becomes visible under the key. */
  abort(reason?: Error): Promise<StreamUploadOutcome>;
  /** Settles once, never rejects. */
  readonly outcome: Promise<StreamUploadOutcome>;
};

export type StreamUploadOptions = {
  contentType?: string;
  /** Multipart part size; S3's minimum is 5 MiB (all parts but the last). */
  partSizeBytes?: number;
  /** Parts in flight at once (default 1); each holds one part in memory. */
  queueSize?: number;
};

/**
 * Starts an upload through lib-storage's Upload: bodies under one part go as one PutObject after the last chunk,
 * larger ones as a multipart upload completed after the last chunk. Either way the key shows nothing until the end,
 * and abort() (or a failure) leaves it untouched; on s3rver, which lacks AbortMultipartUpload, stray parts stay in
 * its private uploads folder, never in the bucket's listing. Memory: about (queueSize + 1) × partSize.
 */
export function startStreamUpload(store: ObjectStore, key: string, options: StreamUploadOptions = {}): StreamUpload {
  const body = new PassThrough({ highWaterMark: MiB });
  // Failures reach the caller through `outcome`; an unheard 'error' event would end the process.
  body.on('error', () => undefined);
  const upload = new Upload({
    client: store.client,
    params: { Bucket: store.bucket, Key: key, Body: body, ContentType: options.contentType },
    partSize: Math.max(5 * MiB, options.partSizeBytes ?? 5 * MiB),
    queueSize: options.queueSize ?? 1,
    leavePartsOnError: false,
  });
  let state: 'open' | 'finishing' | 'aborted' | 'over' = 'open';
  const outcome: Promise<StreamUploadOutcome> = upload.done().then(
    () => {
      state = 'over';
      return { stored: true } as const;
    },
    (error: unknown) => {
      const aborted = state === 'aborted';
      state = 'over';
      body.destroy();
      return aborted ? { stored: false, reason: 'aborted' } : { stored: false, reason: 'failed', error: storageFailure(error, key) };
    },
  );

  return {
    outcome,
    async write(chunk) {
      if (state !== 'open') return false;
      if (body.write(chunk)) return true;
      // Wait for room, or for the upload to end (then 'drain' never comes).
      const room = once(body, 'drain').then(() => true, () => false);
      return Promise.race([room, outcome.then(() => false)]).then((ok) => ok && state === 'open');
    },
    async finish() {
      if (state === 'open') {
        state = 'finishing';
        body.end();
      }
      return outcome;
    },
    async abort(reason) {
      if (state === 'open' || state === 'finishing') {
        state = 'aborted';
        await upload.abort();
        // The part reader may be waiting for bytes: an errored body ends it (a plain end() would store a short object).
        body.destroy(reason ?? new Error('upload aborted'));
      }
      return outcome;
    },
  };
}
