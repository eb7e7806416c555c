import 'server-only';
import { Readable } from 'node:stream';
import { GetObjectCommand } from '@aws-sdk/client-s3';
import { ObjectMissingError, storageCall, stripQuotes, type ObjectStore } from './objects';
import type { ObjectStream } from './stream-object';

/**
 * Opens bytes start..end (inclusive) of one object. The range is always sent as explicit first and last positions:
 * s3rver 3.7.1 misreads suffix ranges ("-n") and a last position of 0. Stores may still send more than asked, so
 * callers stop after end - start + 1 bytes. sizeBytes is the length the store announced for this response.
 */
export async function openObjectRange(store: ObjectStore, key: string, start: number, end: number): Promise<ObjectStream> {
  if (!Number.isSafeInteger(start) || !Number.isSafeInteger(end) || start < 0 || end < start) {
    throw new RangeError(`openObjectRange: bad range ${start}-${end}`);
  }
  const res = await storageCall(
    () => store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key, Range: `bytes=${start}-${end}` })),
    key,
  );
  if (!(res.Body instanceof Readable)) {
    (res.Body as { destroy?: () => void } | undefined)?.destroy?.();
    throw res.Body ? new Error(`object ${key}: the storage client did not return a Node stream`) : new ObjectMissingError(key);
  }
  return { key, sizeBytes: Number(res.ContentLength ?? 0), etag: stripQuotes(res.ETag), body: res.Body };
}
