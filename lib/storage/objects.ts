import 'server-only';
import {
  CopyObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  type S3Client,
} from '@aws-sdk/client-s3';
import { AppError } from '@/lib/errors';
import { bucket, createS3Client, presignClient, presignEndpoint, s3 } from './client';

/** Where objects live: the client that talks to storage, the one that signs browser URLs (and its endpoint), the bucket. */
export type ObjectStore = {
  client: S3Client;
  presigner: S3Client;
  presignEndpoint: string;
  bucket: string;
  /** Learnt on first use: the store answered UploadPartCopy with 501 (s3rver 3.7.1). */
  partCopyUnsupported?: boolean;
};

export type StoredObject = { key: string; sizeBytes: number; etag: string; lastModified: Date };

let shared: ObjectStore | undefined;

export function defaultStore(): ObjectStore {
  shared ??= { client: s3(), presigner: presignClient(), presignEndpoint: presignEndpoint(), bucket: bucket() };
  return shared;
}

/** The same bucket through another endpoint (tests point this at a closed port to play "storage is down"). */
export function storeAt(endpoint: string): ObjectStore {
  const client = createS3Client(endpoint);
  return { client, presigner: client, presignEndpoint: endpoint, bucket: bucket() };
}

export class ObjectMissingError extends Error {
  constructor(readonly key: string) {
    super(`object ${key} does not exist`);
    this.name = 'ObjectMissingError';
  }
}

const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EHOSTUNREACH', 'EAI_AGAIN', 'ECONNABORTED']);

type SdkError = { name?: string; code?: string; $metadata?: { httpStatusCode?: number }; cause?: unknown };

/** True when the store could not be reached or failed on its side (5xx): worth a retry later. */
export function isStorageUnavailable(error: unknown): boolean {
  const e = (error ?? {}) as SdkError;
  if (e instanceof AppError) return e.code === 'service_unavailable';
  if (e.code && NETWORK_CODES.has(e.code)) return true;
  if (e.name === 'TimeoutError' || e.name === 'RequestTimeout' || e.name === 'ServiceUnavailable' || e.name === 'SlowDown') return true;
  const status = e.$metadata?.httpStatusCode;
  if (status !== undefined) return status >= 500 && status !== 501;
  return e.cause !== undefined && isStorageUnavailable(e.cause);
}

export function isNotImplemented(error: unknown): boolean {
  const e = (error ?? {}) as SdkError;
  return e.name === 'NotImplemented' || e.$metadata?.httpStatusCode === 501;
}

function isMissing(error: unknown): boolean {
  const e = (error ?? {}) as SdkError;
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
}

export const STORAGE_DOWN_MESSAGE = 'File storage cannot be reached right now. Nothing was lost: try again in a minute.';

/** Rethrows storage errors in our terms: unreachable → AppError service_unavailable (503), absent key → ObjectMissingError. */
export function storageFailure(error: unknown, key?: string): Error {
  if (error instanceof AppError || error instanceof ObjectMissingError) return error;
  if (isStorageUnavailable(error)) return new AppError('service_unavailable', STORAGE_DOWN_MESSAGE);
  if (key !== undefined && isMissing(error)) return new ObjectMissingError(key);
  return error instanceof Error ? error : new Error(String(error));
}

export async function storageCall<T>(call: () => Promise<T>, key?: string): Promise<T> {
  try {
    return await call();
  } catch (error) {
    throw storageFailure(error, key);
  }
}

export const stripQuotes = (etag: string | undefined): string => (etag ?? '').replace(/"/g, '');

/** Every object under a prefix (all pages), oldest listing order as the store gives it (by key). */
export async function listObjects(store: ObjectStore, prefix: string): Promise<StoredObject[]> {
  const out: StoredObject[] = [];
  let token: string | undefined;
  do {
    const page = await storageCall(() =>
      store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: prefix, ContinuationToken: token })),
    );
    for (const o of page.Contents ?? []) {
      if (o.Key) out.push({ key: o.Key, sizeBytes: Number(o.Size ?? 0), etag: stripQuotes(o.ETag), lastModified: o.LastModified ?? new Date(0) });
    }
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return out;
}

export type ObjectRead = { etag: string; sizeBytes: number; body: AsyncIterable<Uint8Array> };

/** Opens an object as a byte stream; stream failures surface as 503 like failed calls. Stop iterating to close it. */
export async function readObject(store: ObjectStore, key: string): Promise<ObjectRead> {
  const res = await storageCall(() => store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key })), key);
  const body = res.Body as (AsyncIterable<Uint8Array> & { destroy?: () => void }) | undefined;
  if (!body) throw new ObjectMissingError(key);
  return {
    etag: stripQuotes(res.ETag),
    sizeBytes: Number(res.ContentLength ?? 0),
    body: {
      async *[Symbol.asyncIterator]() {
        try {
          for await (const chunk of body) yield chunk;
        } catch (error) {
          throw storageFailure(error, key);
        } finally {
          body.destroy?.();
        }
      },
    },
  };
}

export async function objectExists(store: ObjectStore, key: string): Promise<boolean> {
  try {
    await storageCall(() => store.client.send(new HeadObjectCommand({ Bucket: store.bucket, Key: key })), key);
    return true;
  } catch (error) {
    if (error instanceof ObjectMissingError) return false;
    throw error;
  }
}

/** Deletes keys in batches of 1000 (the DeleteObjects limit); absent keys are fine. */
export async function deleteObjects(store: ObjectStore, keys: string[]): Promise<void> {
  for (let i = 0; i < keys.length; i += 1000) {
    const batch = keys.slice(i, i + 1000);
    const res = await storageCall(() =>
      store.client.send(new DeleteObjectsCommand({ Bucket: store.bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } })),
    );
    const failed = (res.Errors ?? []).filter((e) => e.Code !== 'NoSuchKey');
    if (failed.length) throw new Error(`could not delete ${failed.length} objects, e.g. ${failed[0]?.Key}: ${failed[0]?.Message}`);
  }
}

export async function deletePrefix(store: ObjectStore, prefix: string): Promise<number> {
  const keys = (await listObjects(store, prefix)).map((o) => o.key);
  await deleteObjects(store, keys);
  return keys.length;
}

/** Server-side copy of one object up to 5 GiB (the CopyObject limit); ifMatch guards against a concurrent overwrite. */
export async function copyObject(store: ObjectStore, sourceKey: string, destKey: string, ifMatch?: string): Promise<void> {
  await storageCall(
    () =>
      store.client.send(
        new CopyObjectCommand({
          Bucket: store.bucket,
          Key: destKey,
          CopySource: `${store.bucket}/${encodeURIComponent(sourceKey).replace(/%2F/g, '/')}`,
          CopySourceIfMatch: ifMatch ? `"${ifMatch}"` : undefined,
        }),
      ),
    sourceKey,
  );
}
