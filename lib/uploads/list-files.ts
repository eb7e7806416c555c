import 'server-only';
import { listFileRows, type AnalysisState, type FileRole, type FileRow, type UploadState } from './repo';

/** One file of a version as the API and the deposit screen see it. */
export type FileView = {
  id: string;
  name: string;
  role: FileRole;
  sizeBytes: number;
  sha256: string | null;
  uploadState: UploadState;
  analysisState: AnalysisState;
  /** 0..1 while the worker reads the file. */
  analysisProgress: number;
  analysisError: string | null;
  createdAt: string;
};

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
