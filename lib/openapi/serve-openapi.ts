import { createHash } from 'node:crypto';
import { buildOpenApi } from './build-openapi';
import type { JsonObject } from './embed-schemas';

// The document only changes with a deploy, so it is built once per process and revalidated by ETag.
let cached: { doc: JsonObject; body: string; etag: string } | undefined;

function built(): { doc: JsonObject; body: string; etag: string } {
  if (!cached) {
    const doc = buildOpenApi();
    const body = JSON.stringify(doc, null, 2);
    cached = { doc, body, etag: `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"` };
  }
  return cached;
}

/** The OpenAPI document as served (shared with the API page; treat as read-only). */
export function openApiDocument(): JsonObject {
  return built().doc;
}

const CACHE_CONTROL = 'public, max-age=300, must-revalidate';

/** 200 with the document, or 304 when the client's If-None-Match already names this version (RFC 9110 §13.1.2). */
export function openApiResponse(req: Request): Response {
  const { body, etag } = built();
  const headers = { etag, 'cache-control': CACHE_CONTROL, vary: 'Accept-Encoding' };
  const match = req.headers.get('if-none-match');
  if (match && match.split(',').some((t) => t.trim() === '*' || t.trim().replace(/^W\//, '') === etag)) {
    return new Response(null, { status: 304, headers });
  }
  return new Response(body, { headers: { ...headers, 'content-type': 'application/json; charset=utf-8' } });
}
