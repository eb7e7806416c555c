import { UploadApiError } from './api-client';

/** Statuses worth another try after a pause: no answer, timeouts, rate limits and server-side outages. */
export function isRetryable(err: unknown): boolean {
  if (!(err instanceof UploadApiError)) return false;
  return err.status === 0 || err.status === 408 || err.status === 429 || err.status >= 500;
}

/** The sentence an author reads when an upload step fails; the API's own message is kept where it is meant for people. */
export function describeUploadError(err: unknown): string {
  if (!(err instanceof UploadApiError)) return err instanceof Error ? err.message : 'Something went wrong.';
  switch (err.status) {
    case 0:
      return 'The connection dropped. Check the network, then press Retry; parts already sent are kept.';
    case 401:
      return 'Your session has ended. Sign in again (in another tab, to keep this page), then press Retry.';
    case 403:
      return 'You may not change this draft any more (it may have been submitted, or your group role changed).';
    case 404:
      return 'This upload is no longer on the server (unfinished uploads are cleared after 24 hours). Add the file again to start over.';
    case 409:
      return err.message || 'A file with this name is already in the draft. Remove it first.';
    case 413:
      return err.message || 'This file is larger than the upload limit or your group’s free storage.';
    case 422:
      return err.message || 'The server refused this file.';
    case 429:
      return 'Too many requests just now. Wait a minute, then press Retry.';
    case 503:
      return 'File storage is not answering right now. The upload is kept unfinished and nothing half-saved is recorded; press Retry in a minute.';
    default:
      return err.status >= 500
        ? `The server failed (HTTP ${err.status}). Press Retry; if it keeps failing, tell your group’s curator.`
        : err.message;
  }
}
