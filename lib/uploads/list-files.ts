import 'server-only';
import { listFileRows, type FileRow } from './repo';

// The one definition of a listed file lives with the browser code (pure types), so both sides share it.
export type { FileView } from '@/lib/client/uploads/types';
import type { FileView } from '@/lib/client/uploads/types';

export function toFileView(row: FileRow): FileView {
  return {
    id: row.id,
    name: row.name,
    role: row.role,
    sizeBytes: row.size_bytes,
    // A pending upload shows the digest it declared (kept in declared_sha256 until verified).
    sha256: row.sha256 ?? row.declared_sha256,
    uploadState: row.upload_state,
    analysisState: row.analysis_state,
    analysisProgress: Math.min(1, Math.max(0, row.analysis_progress)),
    analysisError: row.analysis_state === 'failed' ? row.analysis_error : null,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

/** Every file of a version, pending uploads included (the deposit screen offers to resume them), oldest first. */
export async function listFileViews(versionId: string): Promise<FileView[]> {
  return (await listFileRows(versionId)).map(toFileView);
}
