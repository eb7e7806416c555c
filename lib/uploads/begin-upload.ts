import 'server-only';
import { randomUUID } from 'node:crypto';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import { requireVersionAction } from '@/lib/datasets/version-access';
import { presignPartUrls, type PartUrl } from '@/lib/storage/multipart';
import { defaultStore, deletePrefix, type ObjectStore } from '@/lib/storage/objects';
import { validateWith } from '@/lib/validation/validate';
import schema from '@/schemas/api/begin-upload.schema.json';
import { fileTooLargeMessage, maxUploadBytes, PART_URL_TTL_S, planParts, quotaProblem } from './limits';
import { insertPendingUpload, type FileRole } from './repo';
import { checkFileName } from './safe-name';

export type BeginUploadInput = { name: string; sizeBytes: number; sha256: string; role?: FileRole; mediaType?: string };

export type BeginUploadResult = {
  fileId: string;
  /** Equals fileId: parts are staged as objects, so there is no separate storage-side upload id. */
  uploadId: string;
  partSizeBytes: number;
  partCount: number;
  parts: PartUrl[];
  urlsExpireAt: string;
};

type UserLike = { id: string; siteRole: 'admin' | 'user' };

export const stagingPrefix = (fileId: string) => `staging/${fileId}/`;

/**
 * Announces one file of a draft: checks its name and the size limits, records it as pending and signs one PUT URL
 * per part. A pending upload of the same name is replaced; a verified one is a conflict.
 */
export async function beginUpload(
  args: { user: UserLike; versionId: string; input: unknown },
  options: { store?: ObjectStore } = {},
): Promise<BeginUploadResult> {
  const ctx = await requireVersionAction(args.versionId, args.user, 'edit');
  const parsed = validateWith<BeginUploadInput>(schema, args.input);
  if (!parsed.ok) throw new AppError('validation_failed', 'The upload request has errors.', { fieldErrors: parsed.fieldErrors });
  const input = parsed.value;
  const name = checkFileName(input.name);
  if (!name.ok) throw new AppError('validation_failed', name.message, { fieldErrors: { name: name.message } });

  const limit = maxUploadBytes(env().MAX_UPLOAD_BYTES);
  if (input.sizeBytes > limit) {
    throw new AppError('payload_too_large', fileTooLargeMessage(input.sizeBytes, limit), { sizeBytes: input.sizeBytes, limitBytes: limit });
  }
  const fileId = randomUUID();
  const prefix = stagingPrefix(fileId);
  const result = await insertPendingUpload(
    {
      id: fileId, version_id: args.versionId, name: name.name, role: input.role ?? 'raw', media_type: input.mediaType ?? null,
      size_bytes: input.sizeBytes, staging_key: prefix, created_by: args.user.id, declared_sha256: input.sha256,
    },
    ctx.version.group_id,
    (storage) => {
      const problem = quotaProblem(storage, input.sizeBytes);
      if (problem) throw new AppError('payload_too_large', problem, { sizeBytes: input.sizeBytes, ...storage });
    },
  );
  if (result.outcome === 'duplicate') {
    throw new AppError('conflict', `A file named “${name.name}” is already in this version. Remove it first, or give this one another name.`, {
      fieldErrors: { name: 'A file with this name is already in this version.' },
      fileId: result.existing.id,
    });
  }
  const store = options.store ?? defaultStore();
  if (result.replaced?.staging_key) {
    // Best effort: the stale-upload cleanup removes staging objects that no pending row owns.
    await deletePrefix(store, result.replaced.staging_key).catch((error: unknown) =>
      log('warn', 'could not delete the parts of a replaced upload', { fileId: result.replaced?.id, error: String(error) }),
    );
  }
  const plan = planParts(input.sizeBytes);
  const numbers = Array.from({ length: plan.partCount }, (_, i) => i + 1);
  const parts = await presignPartUrls(store, prefix, numbers, PART_URL_TTL_S);
  return {
    fileId,
    uploadId: fileId,
    ...plan,
    parts,
    urlsExpireAt: new Date(Date.now() + PART_URL_TTL_S * 1000).toISOString(),
  };
}
