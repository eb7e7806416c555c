import 'server-only';
import { presignPartUrls, listStagedParts, type PartUrl } from '@/lib/storage/multipart';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import { expectedPartBytes, PART_URL_TTL_S, planParts } from './limits';
import { loadFileFor } from './load-file';
import { touchFile, type UploadState } from './repo';

export type CompletedPart = { partNumber: number; etag: string; sizeBytes: number };

export type UploadStatus = {
  fileId: string;
  name: string;
  sizeBytes: number;
  sha256: string | null;
  uploadState: UploadState;
  partSizeBytes: number;
  partCount: number;
  completedParts: CompletedPart[];
  /** Fresh URLs for the parts still missing (none once verified). */
  parts: PartUrl[];
};

type UserLike = { id: string; siteRole: 'admin' | 'user' };

/**
 * Where an upload stands, for resuming after a dropped connection or a reload: the parts storage holds with the
 * right size, and new URLs for the rest. A part of the wrong size counts as missing, so it is sent again.
 */
export async function getUploadStatus(args: { user: UserLike; fileId: string }, options: { store?: ObjectStore } = {}): Promise<UploadStatus> {
  const { file } = await loadFileFor(args.fileId, args.user, 'edit');
  const plan = planParts(file.size_bytes);
  const base = { fileId: file.id, name: file.name, sizeBytes: file.size_bytes, sha256: file.sha256 ?? file.declared_sha256, uploadState: file.upload_state, ...plan };
  if (file.upload_state !== 'pending' || !file.staging_key) return { ...base, completedParts: [], parts: [] };
  const store = options.store ?? defaultStore();
  const staged = await listStagedParts(store, file.staging_key);
  const completedParts = staged
    .filter((p) => p.partNumber <= plan.partCount && p.sizeBytes === expectedPartBytes(file.size_bytes, plan, p.partNumber))
    .map((p) => ({ partNumber: p.partNumber, etag: p.etag, sizeBytes: p.sizeBytes }));
  const have = new Set(completedParts.map((p) => p.partNumber));
  const missing = Array.from({ length: plan.partCount }, (_, i) => i + 1).filter((n) => !have.has(n));
  await touchFile(file.id);
  return { ...base, completedParts, parts: await presignPartUrls(store, file.staging_key, missing, PART_URL_TTL_S) };
}
