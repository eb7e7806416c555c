import 'server-only';
import type { Readable } from 'node:stream';
import { PutObjectCommand } from '@aws-sdk/client-s3';
import { storageCall, stripQuotes, type ObjectStore } from './objects';

/**
 * Stores one object with a single PutObject (up to 5 GiB). A stream body needs its exact length: the client is set
 * to compute no checksums, so the bytes go unframed (stack.md: aws-chunked framing otherwise corrupts them on s3rver).
 */
export async function putObject(
  store: ObjectStore,
  key: string,
  body: Buffer | string | Readable,
  options: { sizeBytes?: number; contentType?: string } = {},
): Promise<{ etag: string }> {
  const length = typeof body === 'string' ? Buffer.byteLength(body) : Buffer.isBuffer(body) ? body.length : options.sizeBytes;
  if (length === undefined) throw new TypeError('putObject: a stream body needs sizeBytes');
  const res = await storageCall(() =>
    store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: key, Body: body, ContentLength: length, ContentType: options.contentType })),
  );
  return { etag: stripQuotes(res.ETag) };
}
