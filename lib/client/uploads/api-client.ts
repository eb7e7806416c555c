import type {
  AnalysisResponse, BeginUploadRequest, BeginUploadResponse, FetchLike, FileRole, FileView, UploadStatusResponse,
} from './types';

/** An answer from our API or from object storage that was not a success; `status` 0 means no answer at all. */
export class UploadApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'UploadApiError';
  }
}

type ErrorBody = { error?: { code?: string; message?: string; details?: Record<string, unknown> } };

async function errorFrom(res: Response): Promise<UploadApiError> {
  let body: ErrorBody | null = null;
  try {
    body = (await res.json()) as ErrorBody;
  } catch {
    body = null; // object storage answers XML, proxies answer HTML: the status is what counts then
  }
  const e = body?.error;
  return new UploadApiError(res.status, e?.code ?? `http_${res.status}`, e?.message ?? (res.statusText || `HTTP ${res.status}`), e?.details);
}

/** Wraps a thrown network failure (dropped connection, DNS, CORS) so callers see one error type; aborts pass through. */
function networkError(err: unknown, signal?: AbortSignal): unknown {
  if (signal?.aborted) return signal.reason ?? err;
  if (err instanceof UploadApiError) return err;
  return new UploadApiError(0, 'network', err instanceof Error ? err.message : String(err));
}

export type UploadApi = ReturnType<typeof createUploadApi>;

/** Typed calls to /api/v1 for uploads and files, plus the PUT of one part to its presigned URL. */
export function createUploadApi({ fetch, baseUrl = '' }: { fetch: FetchLike; baseUrl?: string }) {
  async function json<T>(method: string, path: string, body?: unknown, signal?: AbortSignal): Promise<T | null> {
    let res: Response;
    try {
      res = await fetch(`${baseUrl}${path}`, {
        method,
        signal,
        credentials: 'same-origin',
        headers: body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
    } catch (err) {
      throw networkError(err, signal);
    }
    if (!res.ok) throw await errorFrom(res);
    if (res.status === 204) return null;
    return (await res.json()) as T;
  }
  const id = encodeURIComponent;

  return {
    beginUpload: async (versionId: string, req: BeginUploadRequest, signal?: AbortSignal) =>
      (await json<BeginUploadResponse>('POST', `/api/v1/versions/${id(versionId)}/uploads`, req, signal))!,
    getUploadStatus: async (fileId: string, signal?: AbortSignal) =>
      (await json<UploadStatusResponse>('GET', `/api/v1/uploads/${id(fileId)}`, undefined, signal))!,
    completeUpload: async (fileId: string, parts: { partNumber: number; etag: string }[] | undefined, signal?: AbortSignal) =>
      (await json<{ file: FileView }>('POST', `/api/v1/uploads/${id(fileId)}/complete`, parts ? { parts } : {}, signal))!.file,
    cancelUpload: async (fileId: string) => {
      await json<null>('DELETE', `/api/v1/uploads/${id(fileId)}`);
    },
    updateFileRole: async (fileId: string, role: FileRole) =>
      (await json<{ file: FileView }>('PATCH', `/api/v1/files/${id(fileId)}`, { role }))!.file,
    removeFile: async (fileId: string) => {
      await json<null>('DELETE', `/api/v1/files/${id(fileId)}`);
    },
    getAnalysis: async (fileId: string, signal?: AbortSignal) =>
      (await json<AnalysisResponse>('GET', `/api/v1/files/${id(fileId)}/analysis`, undefined, signal))!,

    /**
     * PUTs one part to its presigned URL and returns the ETag, or null when the browser may not read it
     * (bucket CORS without `ExposeHeader ETag`); complete then lets the server list the parts itself.
     */
    async putPart(url: string, body: Blob, signal?: AbortSignal): Promise<string | null> {
      let res: Response;
      try {
        res = await fetch(url, { method: 'PUT', body, signal, credentials: 'omit' });
      } catch (err) {
        throw networkError(err, signal);
      }
      if (!res.ok) throw await errorFrom(res);
      await res.body?.cancel().catch(() => undefined); // free the connection for the next part
      return res.headers.get('etag');
    },
  };
}
