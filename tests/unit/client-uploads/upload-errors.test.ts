import { describe, expect, it } from 'vitest';
import { UploadApiError, createUploadApi } from '@/lib/client/uploads/api-client';
import { describeUploadError, isRetryable } from '@/lib/client/uploads/upload-errors';

describe('upload error messages', () => {
  it('keeps the API message for 409, 413 and 422 and explains the rest in plain words', () => {
    expect(describeUploadError(new UploadApiError(409, 'conflict', 'A file named “a.csv” is already in this version; remove it first.')))
      .toBe('A file named “a.csv” is already in this version; remove it first.');
    expect(describeUploadError(new UploadApiError(413, 'payload_too_large', 'This file is 21.5 GB; the limit is 20 GB.'))).toBe('This file is 21.5 GB; the limit is 20 GB.');
    expect(describeUploadError(new UploadApiError(422, 'validation_failed', 'SHA-256 is 12…, but 34… was declared.'))).toBe('SHA-256 is 12…, but 34… was declared.');
    expect(describeUploadError(new UploadApiError(503, 'service_unavailable', 'x'))).toMatch(/^File storage is not answering right now\./);
    expect(describeUploadError(new UploadApiError(0, 'network', 'fetch failed'))).toMatch(/^The connection dropped\./);
    expect(describeUploadError(new UploadApiError(401, 'not_signed_in', 'x'))).toMatch(/^Your session has ended\./);
  });

  it('retries only what may pass: no answer, 408, 429 and 5xx', () => {
    expect([0, 408, 429, 500, 503].map((s) => isRetryable(new UploadApiError(s, 'c', 'm')))).toEqual([true, true, true, true, true]);
    expect([400, 401, 403, 404, 409, 413, 422].map((s) => isRetryable(new UploadApiError(s, 'c', 'm')))).toEqual([false, false, false, false, false, false, false]);
    expect(isRetryable(new TypeError('bug'))).toBe(false);
  });

  it('reads the API error envelope, XML from storage, and a thrown network failure', async () => {
    const answers: (() => Response)[] = [
      () => new Response(JSON.stringify({ error: { code: 'payload_too_large', message: 'Group quota full.', details: { quotaBytes: 5 }, requestId: 'r' } }), { status: 413 }),
      () => new Response('<Error><Code>AccessDenied</Code></Error>', { status: 403, statusText: 'Forbidden' }),
      () => { throw new TypeError('fetch failed'); },
    ];
    const api = createUploadApi({ fetch: async () => answers.shift()!() });
    const begin = api.beginUpload('v1', { name: 'a.csv', sizeBytes: 1, sha256: 'a'.repeat(64) });
    await expect(begin).rejects.toMatchObject({ status: 413, code: 'payload_too_large', message: 'Group quota full.', details: { quotaBytes: 5 } });
    await expect(api.putPart('http://s/x', new Blob(['a']))).rejects.toMatchObject({ status: 403, code: 'http_403', message: 'Forbidden' });
    await expect(api.getAnalysis('f1')).rejects.toMatchObject({ status: 0, code: 'network', message: 'fetch failed' });
  });
});
