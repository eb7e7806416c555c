// GET /api/v1/openapi.json through the real route handler: valid JSON, cache headers, ETag revalidation.
import { describe, expect, it } from 'vitest';
import { GET } from '@/app/api/v1/openapi.json/route';

const get = (headers: Record<string, string> = {}) => GET(new Request('http://localhost/api/v1/openapi.json', { headers }), {});

describe('GET /api/v1/openapi.json', () => {
  it('answers the document as JSON with cache headers and an ETag', async () => {
    const res = await get();
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/json; charset=utf-8');
    expect(res.headers.get('cache-control')).toBe('public, max-age=300, must-revalidate');
    expect(res.headers.get('etag')).toMatch(/^"[A-Za-z0-9_-]{27}"$/);
    expect(res.headers.get('x-request-id')).toBeTruthy();
    const doc = (await res.json()) as { openapi: string; info: { title: string }; paths: Record<string, unknown> };
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.info.title).toBe('Ohmstead API');
    expect(Object.keys(doc.paths)).toContain('/versions/{versionId}/uploads');
  });

  it('answers 304 without a body when If-None-Match names the current ETag, weak or in a list', async () => {
    const etag = (await get()).headers.get('etag')!;
    for (const match of [etag, `W/${etag}`, `"stale", ${etag}`, '*']) {
      const res = await get({ 'if-none-match': match });
      expect(res.status).toBe(304);
      expect(await res.text()).toBe('');
      expect(res.headers.get('etag')).toBe(etag);
    }
    expect((await get({ 'if-none-match': '"an-older-version"' })).status).toBe(200);
  });
});
