import 'server-only';
import { createHash } from 'node:crypto';
import type { PackageCompression } from '@/lib/packages/build-package-stream';
import type { PackageInput } from '@/lib/packages/types';
import { objectExists, type ObjectStore } from '@/lib/storage/objects';
import { presignObjectGet } from '@/lib/storage/presign-get';
import { contentDisposition } from './content-disposition';

// Built packages of published versions are kept in storage and handed out by presigned URL on later requests; the
// worker builds them (package-build-job.ts). Only published, non-anonymous, non-review packages are cached (see
// download-package.ts): drafts change, and review copies (anonymous or marked confidential) are made for one referee
// and must never be served to anyone else.

/** Bump when the package layout or builder changes what a zip holds, so no old zip is served for new inputs. */
export const PACKAGE_FORMAT_VERSION = 1;
/** How long a presigned package URL works: long enough to start the download, short enough not to be passed around. */
export const PACKAGE_URL_TTL_S = 300;

/** JSON with object keys sorted, so the same inputs always give the same text (and hash). */
function canonicalJson(value: unknown): string {
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/**
 * `packages/<versionId>/<sha256>.zip`, the hash over everything that decides the zip's bytes: format version,
 * compression, the record and identifiers, each file's name, digest, size and type, and the anonymous/review flags.
 * The bagging date is left out: a cached package keeps the day it was first built.
 */
export function packageCacheKey(versionId: string, input: PackageInput, compression: PackageCompression = 'store'): string {
  const digest = createHash('sha256').update(canonicalJson({
    format: PACKAGE_FORMAT_VERSION,
    compression,
    metadata: input.metadata,
    files: input.files.map((f) => ({ name: f.name, sha256: f.sha256, sizeBytes: f.sizeBytes, mediaType: f.mediaType ?? null })),
    anonymous: input.anonymous === true,
    reviewCopy: input.reviewCopy === true,
    unpublished: input.unpublished === true,
    bagName: input.bagName ?? null,
  })).digest('hex');
  return `packages/${versionId}/${digest}.zip`;
}

/** A presigned GET of the cached package, or null when it is not (yet) stored. */
export async function cachedPackageUrl(store: ObjectStore, key: string, fileName: string): Promise<string | null> {
  if (!(await objectExists(store, key))) return null;
  return presignObjectGet(store, key, { expiresInS: PACKAGE_URL_TTL_S, contentDisposition: contentDisposition(fileName), contentType: 'application/zip' });
}
