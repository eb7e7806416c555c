import 'server-only';
import { defaultBagName } from '@/lib/packages/bag-layout';
import { buildPackageStream, type PackageCompression } from '@/lib/packages/build-package-stream';
import { log } from '@/lib/log';
import type { PackageInput } from '@/lib/packages/types';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import { authoriseDownload, countDownload, type DownloadGrant, type Downloader, type DownloadRequest } from './authorise-download';
import { contentDisposition } from './content-disposition';
import { loadPackageInput } from './load-package-input';
import { queuePackageBuild } from './package-build-job';
import { cachedPackageUrl, packageCacheKey } from './package-cache';
import type { DownloadReply } from './reply';
import { reportDownloadFailure } from './report-failure';
import { relayStream } from './web-streams';

/**
 * Source chunks under this size (zip headers, tag files) are joined before they go to the client; payload arrives in
 * PAYLOAD_CHUNK_BYTES chunks (build-package-stream.ts) and passes uncopied.
 */
const JOIN = 64 * 1024;

export type DownloadPackageArgs = {
  versionId: string;
  downloader: Downloader;
  request: DownloadRequest;
  requestId: string;
  store?: ObjectStore;
  now?: Date;
  compression?: PackageCompression;
};

/**
 * The reply; for a cacheable package its cache key, and when it streamed, the outbox job that builds the cached copy
 * (null when the job could not be queued: the download goes on, a later one queues it).
 */
export type PackageReply = DownloadReply & { cacheKey: string | null; buildJobId?: number | null };

/**
 * Cached: published versions downloaded by anyone but a reviewer link (embargoed ones too: only those allowed ever get
 * the presigned URL). Built each time and never stored: drafts and versions in review (they change), withdrawn
 * versions (only the site admin may fetch them), and every reviewer-link copy (confidential, maybe anonymous).
 */
export function isCacheablePackage(grant: Pick<DownloadGrant, 'version'>, downloader: Downloader): boolean {
  return grant.version.state === 'published' && downloader.kind === 'user';
}

export function packageHeaders(fileName: string): Record<string, string> {
  return {
    'content-type': 'application/zip',
    'content-disposition': contentDisposition(fileName),
    // no-transform: a zip is already compact, and a proxy must not re-encode a stream it cannot see the end of.
    'cache-control': 'private, no-store, no-transform',
    'x-content-type-options': 'nosniff',
  };
}

export type StreamPackageArgs = {
  input: PackageInput;
  store: ObjectStore;
  compression?: PackageCompression;
  /** The build failed part-way (missing object, storage down): called once; the client's stream errors as well. */
  onFailure: (error: Error) => void;
};

/**
 * The streamed 200 answer for a package: buildPackageStream pulled chunk by chunk as the client reads, nothing else
 * waiting on it (the cached copy is built apart, package-build-job.ts). The route and bench/package.ts both send
 * exactly this stream.
 */
export function streamPackageReply(args: StreamPackageArgs): DownloadReply {
  const pkg = buildPackageStream(args.input, { store: args.store, compression: args.compression ?? 'store' });
  return { status: 200, headers: packageHeaders(pkg.fileName), body: relayStream(pkg.stream, { joinBytes: JOIN, onError: args.onFailure }) };
}

/** Queues the worker's build of the cached copy; a failure to queue is logged and never fails the download. */
async function queueCacheBuild(
  versionId: string, input: PackageInput, cacheKey: string, compression: PackageCompression, baggingDate: Date, requestId: string,
): Promise<number | null> {
  try {
    const payloadBytes = input.files.reduce((sum, f) => sum + f.sizeBytes, 0);
    const job = await queuePackageBuild({ versionId, cacheKey, compression, baggingDate: baggingDate.toISOString() }, payloadBytes);
    return job.jobId;
  } catch (error) {
    log('warn', 'could not queue the build of a cached package', { requestId, key: cacheKey, error: error instanceof Error ? error.message : String(error) });
    return null;
  }
}

/**
 * The zip package (BagIt bag) of one version, after lib/access allowed 'download_files' at `now`. A cached package
 * answers 302 to a presigned GET valid for 5 minutes; otherwise the package streams from storage as the client reads
 * and, when cacheable, an outbox job (one per cache key) has the worker build the cached copy for later requests. A
 * missing object errors the stream (the client sees a broken transfer, never a short valid zip), is logged with the
 * request id and audited as 'package.failed'. Every download counts as one COUNTER request (through a reviewer link:
 * the link's use log). HEAD answers the headers only.
 */
export async function downloadPackage(args: DownloadPackageArgs): Promise<PackageReply> {
  const now = args.now ?? new Date();
  const grant = await authoriseDownload(args.downloader, args.versionId, now);
  const input = await loadPackageInput(grant, args.downloader, now);
  const store = args.store ?? defaultStore();
  const compression = args.compression ?? 'store';
  const fileName = `${defaultBagName(input.metadata.doi)}.zip`;
  const cacheKey = isCacheablePackage(grant, args.downloader) ? packageCacheKey(grant.version.id, input, compression) : null;
  if (args.request.method === 'HEAD') return { status: 200, headers: packageHeaders(fileName), body: null, cacheKey };

  const cachedUrl = cacheKey ? await cachedPackageUrl(store, cacheKey, fileName) : null;
  await countDownload({ downloader: args.downloader, versionId: grant.version.id, fileId: null, request: args.request, requestId: args.requestId, now });
  if (cachedUrl) return { status: 302, headers: { location: cachedUrl, 'cache-control': 'private, no-store' }, body: null, cacheKey };
  // The job's build uses this download's bagging date, so the cached copy holds the same bytes as this stream.
  const bagged: PackageInput = { ...input, baggingDate: now };
  const buildJobId = cacheKey ? await queueCacheBuild(grant.version.id, bagged, cacheKey, compression, now, args.requestId) : undefined;
  const reply = streamPackageReply({
    input: bagged, store, compression,
    onFailure: (error) => void reportDownloadFailure({
      action: 'package.failed', requestId: args.requestId, downloader: args.downloader, groupId: grant.version.group_id, versionId: grant.version.id, error,
    }),
  });
  return { ...reply, cacheKey, ...(buildJobId !== undefined ? { buildJobId } : {}) };
}
