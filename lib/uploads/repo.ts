import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db';

export type FileRole = 'raw' | 'processed' | 'other';
export type UploadState = 'pending' | 'verified' | 'failed';
export type AnalysisState = 'none' | 'queued' | 'running' | 'done' | 'failed';

export type FileRow = {
  id: string;
  version_id: string;
  name: string;
  role: FileRole;
  media_type: string | null;
  size_bytes: number;
  sha256: string | null;
  upload_state: UploadState;
  /** While pending: the SHA-256 the uploader declared (files.sha256 references blobs, so it stays null until verified). */
  declared_sha256: string | null;
  staging_key: string | null;
  analysis_state: AnalysisState;
  analysis_progress: number;
  analysis_error: string | null;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
};

// Every column but the (possibly large) analysis JSON, which only the analysis route reads.
const FILE_COLUMNS = [
  'id', 'version_id', 'name', 'role', 'media_type', 'size_bytes', 'sha256', 'upload_state', 'declared_sha256', 'staging_key',
  'analysis_state', 'analysis_progress', 'analysis_error', 'created_by', 'created_at', 'updated_at',
] as const;

function normalise(row: FileRow): FileRow {
  return { ...row, size_bytes: Number(row.size_bytes), analysis_progress: Number(row.analysis_progress) };
}

export async function findFileRow(fileId: string): Promise<FileRow | undefined> {
  const row = await db()<FileRow>('files').where({ id: fileId }).first(...FILE_COLUMNS);
  return row ? normalise(row as FileRow) : undefined;
}

export async function listFileRows(versionId: string): Promise<FileRow[]> {
  const rows = await db()('files').where({ version_id: versionId }).orderBy([{ column: 'created_at' }, { column: 'name' }]).select(...FILE_COLUMNS);
  return (rows as FileRow[]).map(normalise);
}

export async function blobExists(sha256: string): Promise<boolean> {
  return Boolean(await db()('blobs').where({ sha256 }).first('sha256'));
}

export type NewUpload = Pick<FileRow, 'id' | 'version_id' | 'name' | 'role' | 'media_type' | 'size_bytes' | 'staging_key' | 'created_by'> & {
  declared_sha256: string;
};

export type GroupStorage = { groupName: string; quotaBytes: number; usedBytes: number; pendingBytes: number };

export type InsertUploadResult = { outcome: 'created'; replaced: FileRow | null } | { outcome: 'duplicate'; existing: FileRow };

/**
 * Inserts a pending file in one transaction that locks the group row, so concurrent uploads cannot both pass the
 * quota. A verified file of the same name is a duplicate; a pending or failed one is replaced. `assertRoom` throws
 * to refuse (the transaction then rolls back).
 */
export async function insertPendingUpload(
  file: NewUpload,
  groupId: string,
  assertRoom: (storage: GroupStorage) => void,
): Promise<InsertUploadResult> {
  return db().transaction(async (trx) => {
    const group = await trx('groups').where({ id: groupId }).forUpdate().first('name', 'storage_quota_bytes', 'storage_used_bytes');
    // The unique index compares names with the column's collation; this lookup uses the same comparison.
    const existing = (await trx('files').where({ version_id: file.version_id, name: file.name }).forUpdate().first(...FILE_COLUMNS)) as FileRow | undefined;
    if (existing?.upload_state === 'verified') return { outcome: 'duplicate', existing: normalise(existing) };
    const pending = await trx('files as f')
      .join('dataset_versions as v', 'v.id', 'f.version_id')
      .join('datasets as d', 'd.id', 'v.dataset_id')
      .where({ 'd.group_id': groupId, 'f.upload_state': 'pending' })
      .modify((q) => (existing ? q.whereNot('f.id', existing.id) : q))
      .sum({ bytes: 'f.size_bytes' })
      .first();
    assertRoom({
      groupName: group.name,
      quotaBytes: Number(group.storage_quota_bytes),
      usedBytes: Number(group.storage_used_bytes),
      pendingBytes: Number(pending?.bytes ?? 0),
    });
    if (existing) await trx('files').where({ id: existing.id }).delete();
    await trx('files').insert({ ...file, upload_state: 'pending', analysis_state: 'none' });
    return { outcome: 'created', replaced: existing ? normalise(existing) : null };
  });
}

const RETRYABLE = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);

/** Runs a transaction, again once or twice if InnoDB chose it as a deadlock victim (two uploads of one new blob). */
async function transact<T>(work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt += 1) {
    try {
      return await db().transaction(work);
    } catch (error) {
      if (attempt >= 2 || !RETRYABLE.has((error as { code?: string }).code ?? '')) throw error;
    }
  }
}

export type FinishInput = {
  fileId: string;
  groupId: string;
  sha256: string;
  sizeBytes: number;
  storageKey: string;
  analysisState: 'none' | 'queued';
  /** True when this upload wrote the blob object itself; false when it relied on an existing blob. */
  wroteObject: boolean;
};

export type FinishResult = { outcome: 'verified'; newBlob: boolean } | { outcome: 'blob-missing' } | { outcome: 'not-pending' };

/**
 * Marks a pending file verified and links it to its blob. A new blob row adds its size to the group's storage;
 * an existing one is shared (counted once). 'blob-missing': the blob this upload relied on was removed meanwhile,
 * so the caller writes the object and tries again.
 */
export async function finishVerifiedUpload(input: FinishInput): Promise<FinishResult> {
  return transact(async (trx) => {
    const file = await trx('files').where({ id: input.fileId }).forUpdate().first('upload_state');
    if (!file || file.upload_state !== 'pending') return { outcome: 'not-pending' } as const;
    let newBlob = false;
    if (input.wroteObject) {
      const [res] = (await trx.raw('INSERT IGNORE INTO blobs (sha256, size_bytes, storage_key) VALUES (?, ?, ?)', [
        input.sha256, input.sizeBytes, input.storageKey,
      ])) as [{ affectedRows: number }];
      newBlob = res.affectedRows === 1;
      if (newBlob) await trx('groups').where({ id: input.groupId }).increment('storage_used_bytes', input.sizeBytes);
    } else {
      // A shared lock keeps a concurrent removal from deleting the blob before this file references it.
      const blob = await trx('blobs').where({ sha256: input.sha256 }).forShare().first('sha256');
      if (!blob) return { outcome: 'blob-missing' } as const;
    }
    await trx('files').where({ id: input.fileId }).update({
      sha256: input.sha256, upload_state: 'verified', declared_sha256: null, staging_key: null,
      analysis_state: input.analysisState, analysis_progress: 0, analysis_error: null, updated_at: trx.fn.now(),
    });
    return { outcome: 'verified', newBlob } as const;
  });
}

/** Deletes a file row that is not verified (cancel, failed verification, stale cleanup). True when a row went. */
export async function deleteUnverifiedFile(fileId: string): Promise<boolean> {
  return (await db()('files').where({ id: fileId }).whereNot({ upload_state: 'verified' }).delete()) > 0;
}

export type BlobRef = { sha256: string; storageKey: string; sizeBytes: number };

/**
 * Deletes a verified file row. When no other file references its blob, `onLastReference` runs inside the
 * transaction (it deletes the object; if it throws, nothing changes), then the blob row goes and the group's
 * storage is decremented.
 */
export async function removeVerifiedFile(fileId: string, groupId: string, onLastReference: (blob: BlobRef) => Promise<void>): Promise<{ removed: boolean; blobRemoved: boolean }> {
  return transact(async (trx) => {
    const file = await trx('files').where({ id: fileId }).forUpdate().first('sha256', 'upload_state');
    if (!file || file.upload_state !== 'verified' || !file.sha256) return { removed: false, blobRemoved: false };
    await trx('files').where({ id: fileId }).delete();
    const blob = await trx('blobs').where({ sha256: file.sha256 }).forUpdate().first('sha256', 'storage_key', 'size_bytes');
    // A locking read sees rows committed after this transaction began (a plain read would use the old snapshot).
    const other = blob ? await trx('files').where({ sha256: file.sha256 }).forUpdate().first('id') : undefined;
    if (!blob || other) return { removed: true, blobRemoved: false };
    const ref: BlobRef = { sha256: blob.sha256, storageKey: blob.storage_key, sizeBytes: Number(blob.size_bytes) };
    await onLastReference(ref);
    await trx('blobs').where({ sha256: ref.sha256 }).delete();
    // storage_used_bytes is unsigned: never subtract below zero.
    await trx('groups').where({ id: groupId }).update({
      storage_used_bytes: trx.raw('IF(storage_used_bytes > ?, storage_used_bytes - ?, 0)', [ref.sizeBytes, ref.sizeBytes]),
    });
    return { removed: true, blobRemoved: true };
  });
}

export async function updateFileRole(fileId: string, role: FileRole): Promise<void> {
  await db()('files').where({ id: fileId }).update({ role, updated_at: db().fn.now() });
}

/** Marks a pending upload as active (a resume) so the stale-upload cleanup leaves it alone. */
export async function touchFile(fileId: string): Promise<void> {
  await db()('files').where({ id: fileId }).update({ updated_at: db().fn.now() });
}

/** Uploads that never finished: not verified and untouched since `before`. */
export async function listStaleUploads(before: Date, limit: number): Promise<FileRow[]> {
  const rows = await db()('files').whereNot({ upload_state: 'verified' }).where('updated_at', '<', before).orderBy('updated_at').limit(limit).select(...FILE_COLUMNS);
  return (rows as FileRow[]).map(normalise);
}

/** Which of these ids are uploads still in progress (their staging objects must stay). */
export async function pendingUploadIds(ids: string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows: { id: string }[] = await db()('files').whereIn('id', ids).where({ upload_state: 'pending' }).select('id');
  return new Set(rows.map((r) => r.id));
}

/** The group a version belongs to (for storage accounting). */
export async function groupIdOfVersion(versionId: string): Promise<string | undefined> {
  const row = await db()('dataset_versions as v').join('datasets as d', 'd.id', 'v.dataset_id').where('v.id', versionId).first('d.group_id');
  return row?.group_id;
}
