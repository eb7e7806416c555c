import 'server-only';
import { defaultBagName } from '@/lib/packages/bag-layout';
import { buildPackageStream, type PackageCompression } from '@/lib/packages/build-package-stream';
import { log } from '@/lib/log';
import type { PackageInput } from '@/lib/packages/types';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import type { StreamUploadOutcome } from '@/lib/storage/upload-stream';
import { authoriseDownload, countDownload, type DownloadGrant, type Downloader, type DownloadRequest } from './authorise-download';
import { contentDisposition } from './content-disposition';
import { loadPackageInput } from './load-package-input';
import { cachedPackageUrl, packageCacheKey, teeIntoCache } from './package-cache';
import type { DownloadReply } from './reply';
import { reportDownloadFailure } from './report-failure';
import { relayStream } from './web-streams';

/**
 * Bytes per write to the client: archiver's 64 KiB chunks are joined to 512 KiB. bench/package.ts (HTTP phase, 1 GiB)
 * measured 4.4–5.6 s of server CPU per GiB unjoined, 3.1–3.6 s at 256 KiB, 2.7–3.1 s at 512 KiB, 2.9–3.2 s at 1 MiB.
 */
const JOIN = 512 * 1024;

export type DownloadPackageArgs = {
  versionId: string;
  downloader: Downloader;
  request: DownloadRequest;
  requestId: string;
  store?: ObjectStore;
  now?: Date;
  compression?: PackageCompression;
};

/** The reply, and for a first download of a cacheable package the upload of the cached copy (settles, never rejects). */
export type PackageReply = DownloadReply & { cacheKey: string | null; cached?: Promise<StreamUploadOutcome> };

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
  /** Where to keep a copy for later requests; null streams without caching. */
  cacheKey: string | null;
  /** The build failed part-way (missing object, storage down): called once; the client's stream errors as well. */
  onFailure: (error: Error) => void;
};

/**
 * The streamed 200 answer for a package: buildPackageStream pulled chunk by chunk as the client reads, teed into the
 * cache when cacheKey is set. The route and bench/package.ts both send exactly this stream.
 */
export function streamPackageReply(args: StreamPackageArgs): PackageReply {
  const pkg = buildPackageStream(args.input, { store: args.store, compression: args.compression ?? 'store' });
  const headers = packageHeaders(pkg.fileName);
  if (!args.cacheKey) return { status: 200, headers, body: relayStream(pkg.stream, { onError: args.onFailure }, { joinBytes: JOIN }), cacheKey: null };
  const tee = teeIntoCache(pkg.stream, args.store, args.cacheKey, args.onFailure, JOIN);
  return { status: 200, headers, body: tee.stream, cacheKey: args.cacheKey, cached: tee.cached };
}

/**
 * The zip package (BagIt bag) of one version, after lib/access allowed 'download_files' at `now`. A cached package
 * answers 302 to a presigned GET valid for 5 minutes; otherwise the package streams from storage as the client reads
 * (and, when cacheable, is stored for next time). A missing object errors the stream (the client sees a broken
 * transfer, never a short valid zip), is logged with the request id and audited as 'package.failed'. Every download
 * counts as one COUNTER request (through a reviewer link: the link's use log). HEAD answers the headers only.
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
  // Two first downloads at once both upload; either copy is complete, and the later one simply replaces the other.
  const reply = streamPackageReply({
    input, store, compression, cacheKey,
    onFailure: (error) => void reportDownloadFailure({
      action: 'package.failed', requestId: args.requestId, downloader: args.downloader, groupId: grant.version.group_id, versionId: grant.version.id, error,
    }),
  });
  void reply.cached?.then((outcome) => {
    if (!outcome.stored && outcome.reason === 'failed') {
      log('warn', 'could not keep a package in the cache', { requestId: args.requestId, key: cacheKey, error: outcome.error?.message });
    }
  });
  return reply;
}
