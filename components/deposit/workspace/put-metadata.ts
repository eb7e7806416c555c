// PUT /api/v1/versions/:id/metadata from the browser, and what its answer means for the author (lib/datasets/save-metadata.ts):
// 200 saved; 422 with details.saved = true saved but some values need fixing; anything else not saved.

export type PutOutcome =
  | { saved: true; complete: boolean; fieldErrors: Record<string, string> }
  | { saved: false; retry: boolean; message: string };

type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;
type ErrorBody = { error?: { code?: string; message?: string; details?: { saved?: boolean; fieldErrors?: Record<string, string> } } };

async function bodyOf(res: Response): Promise<unknown> {
  try {
    return await res.json();
  } catch {
    return null;
  }
}

export async function putMetadata(fetcher: FetchLike, versionId: string, record: unknown, keepalive = false): Promise<PutOutcome> {
  let res: Response;
  try {
    res = await fetcher(`/api/v1/versions/${encodeURIComponent(versionId)}/metadata`, {
      method: 'PUT',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(record),
      keepalive,
      credentials: 'same-origin',
    });
  } catch {
    return { saved: false, retry: true, message: 'No connection to Ohmstead. Your changes are kept in this browser and sent when the connection is back.' };
  }
  const body = (await bodyOf(res)) as ErrorBody & { complete?: boolean; errors?: { path: string; message: string }[] };
  if (res.ok) return { saved: true, complete: Boolean(body?.complete), fieldErrors: {} };
  const error = body?.error;
  if (res.status === 422 && error?.details?.saved) {
    return { saved: true, complete: false, fieldErrors: error.details.fieldErrors ?? {} };
  }
  if (res.status === 401) {
    return { saved: false, retry: false, message: 'Your session has ended. Sign in again (in another tab keeps this page); your changes are kept in this browser.' };
  }
  if (res.status === 403 || res.status === 404) {
    return { saved: false, retry: false, message: error?.message ?? 'This draft can no longer be edited by you.' };
  }
  if (res.status === 413 || res.status === 422) {
    return { saved: false, retry: false, message: error?.message ?? 'The record could not be saved as it is.' };
  }
  const reference = res.headers.get('x-request-id');
  return {
    saved: false,
    retry: true,
    message: `Saving failed on the server (${res.status}${reference ? `, reference ${reference}` : ''}). Your changes are kept in this browser; we try again shortly.`,
  };
}
