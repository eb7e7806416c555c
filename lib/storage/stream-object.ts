import 'server-only';
import { Readable } from 'node:stream';
import { GetObjectCommand } from '@aws-sdk/client-s3';
import { ObjectMissingError, storageCall, stripQuotes, type ObjectStore } from './objects';

/** An object's bytes as a Node stream that the caller pipes and must destroy when it stops early (frees the socket). */
export type ObjectStream = { key: string; sizeBytes: number; etag: string; body: Readable };

/**
 * Opens one object for streaming (GetObject). Missing key → ObjectMissingError; unreachable store → AppError 503.
 * Unlike readObject's async iterator, the body is the SDK's own Readable, so destroy() works while a read is pending.
 */
export async function openObjectStream(store: ObjectStore, key: string): Promise<ObjectStream> {
  const res = await storageCall(() => store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key })), key);
  if (!(res.Body instanceof Readable)) {
    (res.Body as { destroy?: () => void } | undefined)?.destroy?.();
    throw res.Body ? new Error(`object ${key}: the storage client did not return a Node stream`) : new ObjectMissingError(key);
  }
  return { key, sizeBytes: Number(res.ContentLength ?? 0), etag: stripQuotes(res.ETag), body: res.Body };
}
