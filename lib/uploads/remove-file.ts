import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { defaultStore, deleteObjects, type ObjectStore } from '@/lib/storage/objects';
import { cancelUpload } from './cancel-upload';
import { loadFileFor } from './load-file';
import { removeVerifiedFile } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' };

/**
 * Removes a file from a draft ('edit' is refused for any other state). Its content goes only when no other file,
 * in any version, still uses it; then the group's storage shrinks by its size. Storage down → 503, nothing changed.
 */
export async function removeFile(args: { user: UserLike; fileId: string }, options: { store?: ObjectStore } = {}): Promise<void> {
  const { file, ctx } = await loadFileFor(args.fileId, args.user, 'edit');
  if (file.upload_state !== 'verified') return cancelUpload(args, options);
  const store = options.store ?? defaultStore();
  const result = await removeVerifiedFile(file.id, ctx.version.group_id, (blob) => deleteObjects(store, [blob.storageKey]));
  if (!result.removed) return;
  await recordAudit({
    action: 'file.remove', actorKind: 'user', actorUserId: args.user.id, groupId: ctx.version.group_id, targetType: 'file', targetId: file.id,
    details: { versionId: file.version_id, name: file.name, sha256: file.sha256, contentRemoved: result.blobRemoved },
  });
}
