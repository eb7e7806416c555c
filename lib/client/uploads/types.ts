// Shapes of the deposit upload API (app/api/v1/uploads, lib/uploads), shared by the server and the browser.
// Pure types here, so that no server module reaches the client bundle.

export type FileRole = 'raw' | 'processed' | 'other';
export type UploadState = 'pending' | 'verified' | 'failed';
export type AnalysisState = 'none' | 'queued' | 'running' | 'done' | 'failed';

/** One file of a version as the server lists it (`listFileViews`). */
export type FileView = {
  id: string;
  name: string;
  role: FileRole;
  sizeBytes: number;
  sha256: string | null;
  uploadState: UploadState;
  analysisState: AnalysisState;
  analysisProgress: number;
  analysisError: string | null;
  createdAt: string;
};

export type PartUrl = { partNumber: number; url: string };
export type CompletedPart = { partNumber: number; etag: string; sizeBytes: number };

export type BeginUploadRequest = { name: string; sizeBytes: number; sha256: string; role?: FileRole; mediaType?: string };
export type BeginUploadResponse = { fileId: string; uploadId: string; partSizeBytes: number; partCount: number; parts: PartUrl[] };

export type UploadStatusResponse = {
  fileId: string;
  name: string;
  sizeBytes: number;
  sha256: string;
  uploadState: UploadState;
  partSizeBytes: number;
  partCount: number;
  completedParts: CompletedPart[];
  parts: PartUrl[];
};

export type AnalysisResponse = { state: AnalysisState; progress: number; error: string | null; summary: unknown };

/** The subset of `fetch` the client uses; injectable so tests can emulate the network. */
export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** The subset of `localStorage` the resume records use. */
export type StorageLike = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

/** A local file: a browser `File`, or node:buffer's `File` in tests. */
export type LocalFile = Blob & { readonly name: string; readonly lastModified: number };
