import 'server-only';
import { can } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import { openObjectStream, type ObjectStream } from '@/lib/storage/stream-object';
import { openObjectRange } from '@/lib/storage/stream-object-range';
import { authoriseDownload, countDownload, type DownloadGrant, type Downloader, type DownloadRequest } from './authorise-download';
import { contentDisposition } from './content-disposition';
import { contentRange, decideRange, ifRangeHolds, rangeLength, unsatisfiedRange, type ByteRange, type RangeDecision } from './range';
import type { DownloadReply } from './reply';
import { findDownloadableFile, type DownloadableFile } from './repo';
import { reportDownloadFailure } from './report-failure';
import { exactBodyStream } from './web-streams';

const NOT_FOUND = 'We could not find this file, or you do not have access to it.';
const STORAGE_FAULT = "This file's stored copy could not be read. The site admin has been told; please try again later.";

export type DownloadFileArgs = {
  fileId: string;
  downloader: Downloader;
  request: DownloadRequest;
  requestId: string;
  store?: ObjectStore;
  now?: Date;
};

/** Files open to anonymous visitors may sit in shared caches (revalidated by ETag); everything else stays private. */
function cacheControl(grant: DownloadGrant, downloader: Downloader, now: Date): string {
  const open = downloader.kind === 'user' && can({ kind: 'anonymous' }, 'download_files', grant.resource, now);
  // no-transform: a compressing proxy (or Next's own gzip) must not alter the bytes that Range and Content-Length count.
  return open ? 'public, max-age=0, must-revalidate, no-transform' : 'private, no-store, no-transform';
}

/** If-None-Match (RFC 9110 §13.1.2): "*" or a list holding our ETag, weak or strong. */
function notModified(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  return ifNoneMatch.split(',').map((t) => t.trim().replace(/^W\//, '')).some((t) => t === '*' || t === etag);
}

async function openBytes(store: ObjectStore, file: DownloadableFile, range: ByteRange | null): Promise<ObjectStream> {
  if (range) return openObjectRange(store, file.storageKey, range.start, range.end);
  const object = await openObjectStream(store, file.storageKey);
  if (object.sizeBytes !== file.sizeBytes) {
    object.body.destroy();
    throw new Error(`${file.storageKey} holds ${object.sizeBytes} bytes, the file row says ${file.sizeBytes}`);
  }
  return object;
}

/**
 * One file of a version: 'download_files' checked through lib/access at `now` (embargo, withdrawal, reviewer links),
 * streamed from storage as the client reads. A single byte range answers 206 (bytes=a-b, a-, -n), an unsatisfiable
 * one 416, several ranges the whole file (RFC 9110 §14.2). ETag is the SHA-256. Counted as a COUNTER request once per
 * download: the whole file, or a range from byte 0 (later segments of the same download are not counted again).
 * A missing or wrong-sized object answers 500 and is logged and audited ('file.download_failed').
 */
export async function downloadFile(args: DownloadFileArgs): Promise<DownloadReply> {
  const now = args.now ?? new Date();
  const file = /^[0-9a-f-]{36}$/i.test(args.fileId) ? await findDownloadableFile(args.fileId) : undefined;
  if (!file) throw new AppError('not_found', NOT_FOUND);
  const grant = await authoriseDownload(args.downloader, file.versionId, now);
  const { headers: h } = args.request;
  const etag = `"${file.sha256}"`;
  const common = { etag, 'accept-ranges': 'bytes', 'cache-control': cacheControl(grant, args.downloader, now) };
  if (notModified(h.get('if-none-match'), etag)) return { status: 304, headers: common, body: null };

  const head = args.request.method === 'HEAD';
  const decision: RangeDecision = !head && ifRangeHolds(h.get('if-range'), etag) ? decideRange(h.get('range'), file.sizeBytes) : { kind: 'whole' };
  if (decision.kind === 'unsatisfiable') {
    const text = `The requested range is not satisfiable: this file has ${file.sizeBytes} bytes.\n`;
    return { status: 416, headers: { ...common, 'content-range': unsatisfiedRange(file.sizeBytes), 'content-type': 'text/plain; charset=utf-8' }, body: text };
  }
  const range = decision.kind === 'partial' ? decision.range : null;
  const length = range ? rangeLength(range) : file.sizeBytes;
  const headers: Record<string, string> = {
    ...common,
    'content-type': file.mediaType ?? 'application/octet-stream',
    'content-length': String(length),
    'content-disposition': contentDisposition(file.name),
    'x-content-type-options': 'nosniff',
    // Opened in a tab anyway (e.g. an HTML file), it runs nothing and loads nothing.
    'content-security-policy': "default-src 'none'; sandbox",
    ...(range ? { 'content-range': contentRange(range, file.sizeBytes) } : {}),
  };
  const status = range ? 206 : 200;
  if (head) return { status, headers, body: null };

  const failure = (error: Error) => reportDownloadFailure({
    action: 'file.download_failed', requestId: args.requestId, downloader: args.downloader, groupId: grant.version.group_id,
    versionId: file.versionId, fileId: file.id, error,
  });
  let object: ObjectStream;
  try {
    object = await openBytes(args.store ?? defaultStore(), file, range);
  } catch (error) {
    if (error instanceof AppError && error.code === 'service_unavailable') throw error;
    await failure(error instanceof Error ? error : new Error(String(error)));
    throw new AppError('internal', STORAGE_FAULT, { reason: 'storage_object_unreadable' });
  }
  if (!range || range.start === 0) {
    await countDownload({ downloader: args.downloader, versionId: file.versionId, fileId: file.id, request: args.request, requestId: args.requestId, now });
  }
  return { status, headers, body: exactBodyStream(object.body, length, (error) => void failure(error)) };
}
