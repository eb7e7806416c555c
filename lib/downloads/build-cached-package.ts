import 'server-only';
import { buildPackageStream, type PackageCompression } from '@/lib/packages/build-package-stream';
import type { PackageInput } from '@/lib/packages/types';
import type { ObjectStore } from '@/lib/storage/objects';
import { startStreamUpload } from '@/lib/storage/upload-stream';

const MiB = 1024 * 1024;
/** S3 takes at most 10 000 parts per multipart upload; the zip's headers and directory fit in the rest. */
const MAX_PARTS = 9_000;
/**
 * Part size of a cache build, and parts in flight at once: while one part goes to storage the next is read and zipped.
 * bench/package.ts (build phase, 1 GiB, 2 runs each) measured 5 MiB × 1: 15–18 MB/s, 15 s of CPU per GiB, 69–74 MB of
 * peak RSS growth; 8 MiB × 1: 20–39 MB/s, 11–13 s, 82–100 MB; 8 MiB × 2: 26–30 MB/s, 12 s, 89–97 MB; 16 MiB × 1:
 * 25–30 MB/s, 9–10 s, 128–134 MB. Each part costs a full garbage collection (its buffers outlive the young generation)
 * and the SDK's SHA-256 of the part for the request signature, hence the CPU.
 */
export const BUILD_PART_BYTES = 8 * MiB;
export const BUILD_QUEUE = 2;

/** The part size for a payload of this many bytes: BUILD_PART_BYTES, larger when it would need too many parts. */
export function buildPartBytes(payloadBytes: number): number {
  return Math.max(BUILD_PART_BYTES, Math.ceil(payloadBytes / MAX_PARTS / MiB) * MiB);
}

export type CachedPackage = { key: string; zipBytes: number; payloadBytes: number };

export type BuildCachedPackageArgs = {
  input: PackageInput;
  store: ObjectStore;
  key: string;
  compression?: PackageCompression;
  /** Stops the build (the worker is shutting down): nothing is stored and the call rejects. */
  signal?: AbortSignal;
  /** Called once with the zip's first bytes, as they go to the upload (bench/package.ts times it). */
  onFirstBytes?: () => void;
  /** Other part size and parts in flight than buildPartBytes() and BUILD_QUEUE (bench/package.ts compares them). */
  partSizeBytes?: number;
  queueSize?: number;
};

const asError = (e: unknown): Error => (e instanceof Error ? e : new Error(String(e)));

/**
 * Builds a package straight into storage under `key`: the zip is streamed from buildPackageStream into a multipart
 * upload (lib/storage/upload-stream.ts), so neither the zip nor a whole file is ever held in memory. The object
 * appears only when the upload completes after the zip's last byte; a failed or stopped build (missing object,
 * storage down, signal) leaves nothing under the key and rejects, and stops reading storage at once.
 */
export async function buildPackageIntoCache(args: BuildCachedPackageArgs): Promise<CachedPackage> {
  const { store, key, signal } = args;
  signal?.throwIfAborted();
  // joinBytes 0: the upload joins the zip's chunks into parts itself, and joining them before as well copies every byte
  // twice (bench:package: 12.3–12.4 s of CPU per GiB with 512 KiB joins, 11.6–11.7 s without).
  const pkg = buildPackageStream(args.input, { store, compression: args.compression ?? 'store', joinBytes: 0 });
  const upload = startStreamUpload(store, key, {
    contentType: 'application/zip',
    partSizeBytes: args.partSizeBytes ?? buildPartBytes(pkg.plan.payloadBytes),
    queueSize: args.queueSize ?? BUILD_QUEUE,
  });
  const reader = pkg.stream.getReader();
  const stopReading = (reason?: unknown) => void reader.cancel(reason).catch(() => undefined);
  const onAbort = () => stopReading(signal?.reason);
  signal?.addEventListener('abort', onAbort, { once: true });
  let zipBytes = 0;
  try {
    let uploading = true;
    for (let r = await reader.read(); !r.done; r = await reader.read()) {
      if (zipBytes === 0) args.onFirstBytes?.();
      zipBytes += r.value.length;
      uploading = await upload.write(r.value);
      if (!uploading) break;
    }
    // A cancelled reader ends like a finished one: only a build that was neither stopped nor refused may complete.
    signal?.throwIfAborted();
    // write() answers false only once the upload has failed or been aborted; the catch below stops the reader.
    if (!uploading) {
      const outcome = await upload.outcome;
      throw (!outcome.stored && outcome.error) || new Error(`the upload of ${key} was aborted`);
    }
    const outcome = await upload.finish();
    if (!outcome.stored) throw outcome.error ?? new Error(`the upload of ${key} was aborted`);
    return { key, zipBytes, payloadBytes: pkg.plan.payloadBytes };
  } catch (error) {
    const failure = asError(error);
    stopReading(failure);
    await upload.abort(failure);
    throw failure;
  } finally {
    signal?.removeEventListener('abort', onAbort);
  }
}
