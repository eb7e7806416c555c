import 'server-only';
import { log } from '@/lib/log';
import { defaultStore, deleteObjects, deletePrefix, listObjects, type ObjectStore } from '@/lib/storage/objects';
import { STALE_UPLOAD_MS } from './limits';
import { deleteUnverifiedFile, listStaleUploads, pendingUploadIds } from './repo';

export type CleanupOptions = {
  store?: ObjectStore;
  /** Uploads untouched this long are abandoned (default 24 h). */
  olderThanMs?: number;
  /** Staging objects no pending upload owns are deleted once this old (a PUT that arrived after a cancel). */
  orphanGraceMs?: number;
  limit?: number;
  now?: Date;
};

export type CleanupResult = { uploadsRemoved: number; orphanObjectsRemoved: number };

/**
 * Removes uploads that never finished (row and staged parts), then staged parts whose upload is gone: what a
 * cancel could not delete while storage was down, or what a browser PUT after the cancel left behind.
 */
export async function cleanupStaleUploads(options: CleanupOptions = {}): Promise<CleanupResult> {
  const store = options.store ?? defaultStore();
  const now = (options.now ?? new Date()).getTime();
  let uploadsRemoved = 0;
  for (const file of await listStaleUploads(new Date(now - (options.olderThanMs ?? STALE_UPLOAD_MS)), options.limit ?? 200)) {
    if (!(await deleteUnverifiedFile(file.id))) continue;
    uploadsRemoved += 1;
    if (file.staging_key) await deletePrefix(store, file.staging_key);
  }

  const byUpload = new Map<string, { keys: string[]; newest: number }>();
  for (const o of await listObjects(store, 'staging/')) {
    const id = o.key.split('/')[1] ?? '';
    const entry = byUpload.get(id) ?? { keys: [], newest: 0 };
    entry.keys.push(o.key);
    entry.newest = Math.max(entry.newest, o.lastModified.getTime());
    byUpload.set(id, entry);
  }
  const live = await pendingUploadIds([...byUpload.keys()].filter((id) => /^[0-9a-f-]{36}$/i.test(id)));
  const graceMs = options.orphanGraceMs ?? 3600_000;
  const orphanKeys = [...byUpload].filter(([id, e]) => !live.has(id) && e.newest < now - graceMs).flatMap(([, e]) => e.keys);
  await deleteObjects(store, orphanKeys);
  if (uploadsRemoved || orphanKeys.length) log('info', 'cleaned up abandoned uploads', { uploadsRemoved, orphanObjectsRemoved: orphanKeys.length });
  return { uploadsRemoved, orphanObjectsRemoved: orphanKeys.length };
}
