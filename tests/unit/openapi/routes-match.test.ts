// The OpenAPI document lists exactly the methods the route files export: a route added without documenting it, or
// documentation left behind after a route is removed, fails here.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildOpenApi } from '@/lib/openapi/build-openapi';
import { OPERATIONS } from '@/lib/openapi/routes';
import { documentedOperations, exportedMethods, openApiPath, routeOperations } from './route-files';

const API_ROOT = path.resolve(import.meta.dirname, '../../../app/api/v1');

describe('route files and the OpenAPI document', () => {
  const inCode = routeOperations(API_ROOT);
  const inDocument = documentedOperations(buildOpenApi() as { paths: Record<string, Record<string, unknown>> });

  it('documents every exported method of every app/api/v1 route', () => {
    expect(inCode.filter((op) => !inDocument.includes(op))).toEqual([]);
  });

  it('documents no method that no route exports', () => {
    expect(inDocument.filter((op) => !inCode.includes(op))).toEqual([]);
  });

  it('finds the routes this check is about (sanity: the walk reads real files)', () => {
    expect(inCode).toContain('POST /datasets');
    expect(inCode).toContain('PUT /versions/{versionId}/metadata');
    expect(inCode).toContain('DELETE /groups/{slug}/invitations/{invitationId}');
    expect(inCode).toContain('GET /openapi.json');
  });
});

describe('reading route files', () => {
  it('reads const, function and re-exported handlers, not other exports', () => {
    const source = [
      "export const dynamic = 'force-dynamic';",
      'export const GET = route(async () => Response.json({}));',
      'export async function POST(req: Request) { return new Response(null); }',
      'export function PATCH() { return new Response(null); }',
      "export { handler as DELETE, other } from './x';",
      'export type { PUT } from "./types";',
      'const HEAD = 1; // not exported',
    ].join('\n');
    expect(exportedMethods(source)).toEqual(['DELETE', 'GET', 'PATCH', 'POST']);
  });

  it('maps [param] folders to {param} and drops route groups', () => {
    expect(openApiPath('versions/[versionId]/reviewer-links/access-log')).toBe('/versions/{versionId}/reviewer-links/access-log');
    expect(openApiPath('(admin)/groups/[slug]/members/[userId]')).toBe('/groups/{slug}/members/{userId}');
    expect(openApiPath('files/[...path]')).toBe('/files/{path}');
    expect(openApiPath('openapi.json')).toBe('/openapi.json');
  });

  it('reports an undocumented route and a stale entry (the comparison can fail)', () => {
    const inCode = routeOperations(API_ROOT);
    const missing = (ops: typeof OPERATIONS) => {
      const documented = documentedOperations(buildOpenApi(ops) as { paths: Record<string, Record<string, unknown>> });
      return { undocumented: inCode.filter((op) => !documented.includes(op)), stale: documented.filter((op) => !inCode.includes(op)) };
    };
    expect(missing(OPERATIONS.filter((op) => op.operationId !== 'publishVersion')).undocumented).toEqual(['POST /versions/{versionId}/publish']);
    expect(missing([...OPERATIONS, { ...OPERATIONS[0], operationId: 'gone', path: '/no-such-route' }]).stale).toEqual(['POST /no-such-route']);
  });
});
