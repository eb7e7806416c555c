import 'server-only';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log';
import { defaultStore, deletePrefix, type ObjectStore } from '@/lib/storage/objects';
import { loadFileFor } from './load-file';
import { deleteUnverifiedFile } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' };

/**
 * Cancels an upload in progress: the row goes first (so nothing half-uploaded is ever listed), then its staged
 * parts. If storage is down the parts stay until cleanupStaleUploads sweeps staging objects no pending row owns.
 */
export async function cancelUpload(args: { user: UserLike; fileId: string }, options: { store?: ObjectStore } = {}): Promise<void> {
  const { file } = await loadFileFor(args.fileId, args.user, 'edit');
  if (file.upload_state === 'verified') {
    throw new AppError('conflict', 'This file is already uploaded and verified; remove it from the version instead (DELETE /api/v1/files/:fileId).');
  }
  await deleteUnverifiedFile(file.id);
  if (!file.staging_key) return;
  try {
    await deletePrefix(options.store ?? defaultStore(), file.staging_key);
  } catch (error) {
    log('warn', 'cancelled upload: parts left for the cleanup', { fileId: file.id, error: error instanceof Error ? error.message : String(error) });
  }
}
