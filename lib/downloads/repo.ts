import 'server-only';
import { db } from '@/lib/db';

// Files as downloads need them: verified rows joined with the blob that holds their bytes.

export type DownloadableFile = {
  id: string;
  versionId: string;
  name: string;
  mediaType: string | null;
  sizeBytes: number;
  sha256: string;
  storageKey: string;
};

const COLUMNS = ['f.id', 'f.version_id', 'f.name', 'f.media_type', 'f.size_bytes', 'f.sha256', 'b.storage_key'] as const;

type Row = { id: string; version_id: string; name: string; media_type: string | null; size_bytes: number | string; sha256: string; storage_key: string };

const toFile = (r: Row): DownloadableFile => ({
  id: r.id, versionId: r.version_id, name: r.name, mediaType: r.media_type, sizeBytes: Number(r.size_bytes), sha256: r.sha256, storageKey: r.storage_key,
});

/** One verified file; pending or failed uploads and unknown ids are simply not found. */
export async function findDownloadableFile(fileId: string): Promise<DownloadableFile | undefined> {
  const row = await db()('files as f').join('blobs as b', 'b.sha256', 'f.sha256').where({ 'f.id': fileId, 'f.upload_state': 'verified' }).first(...COLUMNS);
  return row ? toFile(row as Row) : undefined;
}

/** The verified files of a version by name, the order the DataCite record lists them in (publishing/repo.ts). */
export async function listDownloadableFiles(versionId: string): Promise<DownloadableFile[]> {
  const rows = await db()('files as f').join('blobs as b', 'b.sha256', 'f.sha256')
    .where({ 'f.version_id': versionId, 'f.upload_state': 'verified' }).orderBy([{ column: 'f.name' }]).select(...COLUMNS);
  return (rows as Row[]).map(toFile);
}
