import { UploadApiError, type UploadApi } from './api-client';
import type { ResumeStore } from './resume-store';
import type { FileRole, FileView, LocalFile, UploadStatusResponse } from './types';

type Retry = <T>(what: string, step: () => Promise<T>) => Promise<T>;

export type OpenedUpload =
  /** `replaced`: the upload known before was dropped and a new one begun (the caller forgets the old id). */
  | { replaced: boolean; status: UploadStatusResponse }
  | { replaced: false; verified: FileView };

/**
 * Begins a multipart upload, or, for a file the server already knows, asks which parts are still missing.
 * A different file under that id (other SHA-256), a failed or vanished upload: begin again (it replaces the old one).
 */
export async function openUpload(args: {
  api: UploadApi; store: ResumeStore; versionId: string; file: LocalFile; sha256: string; fileId: string | null;
  role?: FileRole; signal: AbortSignal; retry: Retry;
}): Promise<OpenedUpload> {
  const { api, store, file, sha256, fileId, signal } = args;
  if (fileId) {
    try {
      const status = await args.retry('The server did not answer', () => api.getUploadStatus(fileId, signal));
      if (status.sha256 === sha256 && status.uploadState === 'verified') {
        store.remove(fileId);
        return { replaced: false, verified: verifiedFromStatus(status, args.role) };
      }
      if (status.sha256 === sha256 && status.uploadState === 'pending') return { replaced: false, status };
    } catch (err) {
      if (!(err instanceof UploadApiError && err.status === 404)) throw err;
    }
    store.remove(fileId);
  }
  const begun = await args.retry('The server did not answer', () => api.beginUpload(args.versionId, {
    name: file.name, sizeBytes: file.size, sha256, ...(file.type ? { mediaType: file.type } : {}),
  }, signal));
  store.save({ versionId: args.versionId, fileId: begun.fileId, name: file.name, sizeBytes: file.size, lastModified: file.lastModified, sha256 });
  return {
    replaced: fileId !== null,
    status: {
      fileId: begun.fileId, name: file.name, sizeBytes: file.size, sha256, uploadState: 'pending',
      partSizeBytes: begun.partSizeBytes, partCount: begun.partCount, completedParts: [], parts: begun.parts,
    },
  };
}

/** Completes; when the answer is lost, asks whether the server finished anyway before the caller tries again. */
export async function completeUpload(
  api: UploadApi, fileId: string, parts: { partNumber: number; etag: string }[] | undefined, signal: AbortSignal, role?: FileRole,
): Promise<FileView> {
  try {
    return await api.completeUpload(fileId, parts, signal);
  } catch (err) {
    if (!(err instanceof UploadApiError && err.status === 0)) throw err;
    const status = await api.getUploadStatus(fileId, signal).catch(() => null);
    if (status?.uploadState === 'verified') return verifiedFromStatus(status, role);
    throw err;
  }
}

/** The upload finished in a run whose answer was lost; the next server listing brings the full view. */
function verifiedFromStatus(s: UploadStatusResponse, role: FileRole = 'other'): FileView {
  return {
    id: s.fileId, name: s.name, role, sizeBytes: s.sizeBytes, sha256: s.sha256, uploadState: 'verified',
    analysisState: 'queued', analysisProgress: 0, analysisError: null, createdAt: new Date().toISOString(),
  };
}
