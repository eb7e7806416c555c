import 'server-only';
// Streams a version's BagIt package as a zip: tag files from memory, then one S3 object at a time through archiver.
import type { Readable } from 'node:stream';
import { ZipArchive } from 'archiver';
import { log } from '@/lib/log';
import { defaultStore, storageFailure, type ObjectStore } from '@/lib/storage/objects';
import { openObjectStream } from '@/lib/storage/stream-object';
import { planBag } from './bag-layout';
import { JoinChunks } from './join-chunks';
import { routeCrc32ToZlib } from './native-crc32';
import type { BagPlan, PackageInput, PayloadEntry } from './types';

routeCrc32ToZlib();

export type PackageCompression = 'store' | 'deflate';

/**
 * Payload bytes are joined to chunks of this size before archiver (join-chunks.ts), so the zip leaves in chunks this
 * large. bench/package.ts (HTTP phase, 1 GiB, 4 runs each, alternating) measured 3.2–3.5 s of server CPU per GiB with
 * storage's 64 KiB chunks joined to 512 KiB only after archiver, and 2.4–3.0 s joined before it (and the archive read
 * chunk by chunk, not through its async iterator); earlier, 4.4–5.6 s with no joining at all.
 */
export const PAYLOAD_CHUNK_BYTES = 512 * 1024;

export type PackageStreamOptions = {
  store?: ObjectStore;
  /**
   * How payload files are written; tag files are always deflated (small text). Default 'store': bench/package.ts on
   * 1 GiB of CSV measured store at 0.86 of raw S3 GET speed, deflate level 1 at 0.19 (zip 30 % of the payload) and
   * level 6 at 0.05 (25 %) on this 2-core machine.
   */
  compression?: PackageCompression;
  /** zlib level for deflated entries (tag files, and payload when compression is 'deflate'), 1–9; default 1. */
  deflateLevel?: number;
  /**
   * Payload bytes are joined to chunks of at least this many before archiver (default PAYLOAD_CHUNK_BYTES); 0 passes
   * storage's chunks on as they come (a consumer that joins them anyway, like a multipart upload, saves a copy).
   */
  joinBytes?: number;
  /** Called with each storage body once archiver is piping it (logging, tests that watch the socket); read-only use. */
  onObjectOpened?: (key: string, body: Readable) => void;
};

export type PackageStream = { stream: ReadableStream<Uint8Array>; plan: BagPlan; fileName: string };

/** Storage gave other bytes than the database describes: the package would not verify, so it is not finished. */
export class PackageIntegrityError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PackageIntegrityError';
  }
}

type Feed = { archive: ZipArchive; current?: Readable; cancelled: boolean; processed: number; appended: number };

/** Appends one storage body and resolves once archiver has written the entry with exactly the expected byte count. */
function appendObject(feed: Feed, body: Readable, name: string, entry: PayloadEntry, options: PackageStreamOptions, date: Date): Promise<void> {
  const { archive } = feed;
  const key = entry.file.storageKey;
  const target = ++feed.appended;
  return new Promise<void>((resolve, reject) => {
    let bytes = 0;
    let ended = false;
    const finish = (error?: Error) => {
      archive.off('entry', onEntry);
      archive.off('error', finish);
      body.off('data', onData).off('end', onEnd).off('error', onError).off('close', onClose);
      if (error) reject(error);
      else resolve();
    };
    const onData = (chunk: Buffer) => void (bytes += chunk.length);
    const onEnd = () => void (ended = true);
    const onError = (error: unknown) => finish(storageFailure(error, key));
    const onClose = () => {
      if (!ended) finish(new PackageIntegrityError(`storage closed ${key} after ${bytes} of ${entry.file.sizeBytes} bytes`));
    };
    const onEntry = () => {
      if (feed.processed < target) return;
      if (bytes === entry.file.sizeBytes) finish();
      else finish(new PackageIntegrityError(`${key} gave ${bytes} bytes, the version lists ${entry.file.sizeBytes} for ${entry.path}`));
    };
    archive.on('entry', onEntry);
    archive.on('error', finish);
    // archiver pipes the joined body at once; listeners added in the same tick see every chunk.
    const joinBytes = options.joinBytes ?? PAYLOAD_CHUNK_BYTES;
    archive.append(joinBytes > 0 ? body.pipe(new JoinChunks(joinBytes)) : body, { name, date, store: options.compression !== 'deflate' });
    body.on('data', onData).on('end', onEnd).on('error', onError).on('close', onClose);
    options.onObjectOpened?.(key, body);
  });
}

async function feedArchive(feed: Feed, plan: BagPlan, options: PackageStreamOptions): Promise<void> {
  const date = plan.baggingDate;
  for (const tag of plan.tagFiles) {
    feed.appended++;
    feed.archive.append(tag.content, { name: `${plan.bagName}/${tag.path}`, date });
  }
  // Resolved after the tag files are queued, so a cold start (env check, client set-up) does not delay the first byte.
  const store = options.store ?? defaultStore();
  for (const entry of plan.payload) {
    if (feed.cancelled) return;
    const object = await openObjectStream(store, entry.file.storageKey);
    if (feed.cancelled) return void object.body.destroy();
    feed.current = object.body;
    if (object.sizeBytes !== entry.file.sizeBytes) {
      object.body.destroy();
      throw new PackageIntegrityError(`${object.key} holds ${object.sizeBytes} bytes, the version lists ${entry.file.sizeBytes} for ${entry.path}`);
    }
    await appendObject(feed, object.body, `${plan.bagName}/${entry.path}`, entry, options, date);
    feed.current = undefined;
  }
  // finalize() also reports failures through the stream's 'error', which the reader sees; its promise is not needed.
  feed.archive.finalize().catch(() => undefined);
}

/**
 * A zip of the bag, pulled chunk by chunk: nothing is read from storage faster than the consumer reads the stream.
 * cancel() (client gone) destroys the open storage body and the archive. A missing or short object errors the stream
 * before the zip's central directory is written, so a client never gets a silently incomplete package.
 */
export function streamBag(plan: BagPlan, options: PackageStreamOptions = {}): ReadableStream<Uint8Array> {
  const level = options.deflateLevel ?? 1;
  const feed: Feed = { archive: new ZipArchive({ zlib: { level } }), cancelled: false, processed: 0, appended: 0 };
  let failure: Error | undefined;
  feed.archive.on('entry', () => void feed.processed++);
  // archiver reports some failures with emit('error'); keep one listener for the stream's whole life (an unheard
  // 'error' would end the process), and let the reader see the failure.
  feed.archive.on('error', (error: Error) => {
    if (!feed.cancelled) failure ??= error;
  });

  feedArchive(feed, plan, options).catch((error: unknown) => {
    if (feed.cancelled) return;
    failure = error instanceof Error ? error : new Error(String(error));
    log('error', 'package stream failed', { bag: plan.bagName, error: failure.message });
    feed.current?.destroy();
    feed.archive.destroy(failure);
  });

  // The archive flows chunk by chunk into the stream's queue and pauses whenever the queue is full; pull() resumes it.
  // (Its async iterator would hand on everything buffered as one new, copied chunk.)
  let settled = false;
  return new ReadableStream<Uint8Array>({
    start(controller) {
      const { archive } = feed;
      const fail = (error: Error) => {
        if (settled || feed.cancelled) return;
        settled = true;
        controller.error(error);
      };
      archive.on('data', (chunk: Buffer) => {
        if (settled || feed.cancelled) return;
        controller.enqueue(chunk);
        if ((controller.desiredSize ?? 0) <= 0) archive.pause();
      });
      archive.on('end', () => {
        if (failure) return fail(failure);
        if (settled || feed.cancelled) return;
        settled = true;
        controller.close();
      });
      archive.on('error', (error: Error) => fail(failure ?? error));
      archive.on('close', () => fail(failure ?? new Error(`the zip of ${plan.bagName} closed before its end`)));
    },
    pull() {
      feed.archive.resume();
    },
    cancel() {
      feed.cancelled = true;
      feed.current?.destroy();
      feed.archive.abort();
      feed.archive.destroy();
    },
  });
}

/** Plans the bag of one version and streams it; fileName is what a download should be called. */
export function buildPackageStream(input: PackageInput, options: PackageStreamOptions = {}): PackageStream {
  const plan = planBag(input);
  return { stream: streamBag(plan, options), plan, fileName: `${plan.bagName}.zip` };
}
