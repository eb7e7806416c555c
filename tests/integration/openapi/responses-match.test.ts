// The OpenAPI document against real answers: a script's deposit-to-download run through the /api/v1 route handlers
// with a Bearer token, each answer's status checked to be documented and its body validated against the documented
// schema (Ajv over the built document). Refusals are checked against the Error component the same way.
import { createHash, randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST as createDatasetRoute } from '@/app/api/v1/datasets/route';
import { GET as draftsRoute } from '@/app/api/v1/drafts/route';
import { GET as analysisRoute } from '@/app/api/v1/files/[fileId]/analysis/route';
import { PATCH as updateFileRoute } from '@/app/api/v1/files/[fileId]/route';
import { GET as groupRoute } from '@/app/api/v1/groups/[slug]/route';
import { GET as invitationsRoute, POST as inviteRoute } from '@/app/api/v1/groups/[slug]/invitations/route';
import { DELETE as revokeInvitationRoute } from '@/app/api/v1/groups/[slug]/invitations/[invitationId]/route';
import { GET as membersRoute } from '@/app/api/v1/groups/[slug]/members/route';
import { GET as groupsRoute } from '@/app/api/v1/groups/route';
import { GET as auditRoute } from '@/app/api/v1/audit/route';
import { GET as basketRoute } from '@/app/api/v1/compare/items/route';
import { GET as tokensRoute } from '@/app/api/v1/tokens/route';
import { POST as completeRoute } from '@/app/api/v1/uploads/[fileId]/complete/route';
import { GET as uploadStatusRoute } from '@/app/api/v1/uploads/[fileId]/route';
import { GET as citationRoute } from '@/app/api/v1/versions/[versionId]/citation/route';
import { GET as dataciteRoute } from '@/app/api/v1/versions/[versionId]/datacite/route';
import { PUT as metadataRoute } from '@/app/api/v1/versions/[versionId]/metadata/route';
import { POST as newVersionRoute } from '@/app/api/v1/versions/[versionId]/new-version/route';
import { GET as packageRoute } from '@/app/api/v1/versions/[versionId]/package/route';
import { POST as publishRoute } from '@/app/api/v1/versions/[versionId]/publish/route';
import { GET as accessLogRoute } from '@/app/api/v1/versions/[versionId]/reviewer-links/access-log/route';
import { GET as listLinksRoute, POST as createLinkRoute } from '@/app/api/v1/versions/[versionId]/reviewer-links/route';
import { DELETE as revokeLinkRoute } from '@/app/api/v1/reviewer-links/[linkId]/route';
import { GET as versionRoute } from '@/app/api/v1/versions/[versionId]/route';
import { POST as submitRoute } from '@/app/api/v1/versions/[versionId]/submit/route';
import { POST as beginUploadRoute } from '@/app/api/v1/versions/[versionId]/uploads/route';
import { POST as withdrawRoute } from '@/app/api/v1/versions/[versionId]/withdraw/route';
import { db } from '@/lib/db';
import { buildOpenApi } from '@/lib/openapi/build-openapi';
import { deref } from '@/lib/openapi/describe-schema';
import type { JsonObject } from '@/lib/openapi/embed-schemas';
import { resetLimit } from '@/lib/rate-limit/rate-limit';
import { API_PER_IP_ANONYMOUS, API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import { createToken } from '@/lib/tokens/create-token';
import { documentAjv } from '@/tests/unit/openapi/document-ajv';
import { completeRecord, makePubLab, removePubLab, type PubLab } from '../publishing/fixtures';

const doc = buildOpenApi();
const { ajv, compileRef } = documentAjv(doc);
const ip = `198.51.100.7-${randomBytes(3).toString('hex')}`;
const CSV = readFileSync(path.resolve(import.meta.dirname, '../../fixtures/transport/cu-wire-rt.csv'));
const CSV_SHA256 = createHash('sha256').update(CSV).digest('hex');

let lab: PubLab;
let token = '';
let readOnly = '';
const tokenIds: string[] = [];

beforeAll(async () => {
  lab = await makePubLab();
  for (const scopes of [['deposit', 'publish'], ['read']]) {
    const created = await createToken({ id: lab.owner.id, via: 'session' }, { name: `openapi check ${scopes.join('+')}`, scopes });
    tokenIds.push(created.id);
    if (scopes.length === 2) token = created.token;
    else readOnly = created.token;
  }
});
afterAll(async () => {
  for (const id of tokenIds) await resetLimit(API_PER_TOKEN, id);
  await resetLimit(API_PER_IP_ANONYMOUS, ip);
  await removePubLab(lab, [CSV_SHA256]);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

function request(method: string, url: string, opts: { bearer?: string | null; body?: unknown } = {}): Request {
  const headers: Record<string, string> = { 'x-forwarded-for': ip };
  const bearer = opts.bearer === undefined ? token : opts.bearer;
  if (bearer) headers.authorization = `Bearer ${bearer}`;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  return new Request(`http://localhost/api/v1${url}`, { method, headers, body: opts.body === undefined ? undefined : JSON.stringify(opts.body) });
}

/**
 * Calls a route handler and checks the answer against the document entry of `docPath`: the status must be listed, and
 * a JSON body (any +json type) must pass the schema documented for its media type. Returns the parsed body.
 */
async function call<C>(handler: Handler<C>, method: string, docPath: string, url: string, ctx: C, opts: { bearer?: string | null; body?: unknown } = {}) {
  const res = await handler(request(method.toUpperCase(), url, opts), ctx);
  // 500 is documented for every route, but here it always means the check itself went wrong.
  expect(res.status, `${method.toUpperCase()} ${url} failed on the server`).not.toBe(500);
  const entry = ((doc.paths as Record<string, Record<string, JsonObject>>)[docPath]?.[method]?.responses as Record<string, JsonObject>)?.[String(res.status)];
  expect(entry, `${method.toUpperCase()} ${docPath} answered ${res.status}, which the document does not list`).toBeDefined();
  const content = (deref(doc, entry) as { content?: Record<string, { schema?: JsonObject }> }).content ?? {};
  const mediaType = (res.headers.get('content-type') ?? '').split(';')[0].trim();
  if (res.status === 204 || res.status === 302) return { res, body: null as unknown };
  expect(Object.keys(content), `${docPath} ${res.status}: media type ${mediaType} is not documented`).toContain(mediaType);
  if (!/[/+]json$/.test(mediaType)) return { res, body: (await res.arrayBuffer()) as unknown };
  const body: unknown = await res.json();
  const schema = content[mediaType].schema!;
  const validate = typeof schema.$ref === 'string' ? compileRef(schema.$ref) : ajv.compile(schema);
  expect({ where: `${method.toUpperCase()} ${url} → ${res.status}`, errors: validate(body) ? null : validate.errors }).toEqual({ where: `${method.toUpperCase()} ${url} → ${res.status}`, errors: null });
  return { res, body };
}

const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });

describe('documented answers of a deposit-to-download script', () => {
  let versionId = '';
  let fileId = '';

  it('creates a dataset, uploads a file in parts and completes it', async () => {
    const created = await call(createDatasetRoute, 'post', '/datasets', '/datasets', {}, { body: { group: lab.slug, title: 'R(T) of an OpenAPI-check copper wire' } });
    versionId = (created.body as { versionId: string }).versionId;
    expect(created.res.status).toBe(201);
    // The schema check has teeth: the same answer with another version number does not pass.
    expect(compileRef('#/components/schemas/CreatedDataset')({ ...(created.body as object), versionNumber: 2 })).toBe(false);
    await call(draftsRoute, 'get', '/drafts', '/drafts', {});

    const begin = await call(beginUploadRoute, 'post', '/versions/{versionId}/uploads', `/versions/${versionId}/uploads`, params({ versionId }), {
      body: { name: 'cu-wire-rt.csv', sizeBytes: CSV.length, sha256: CSV_SHA256, role: 'raw', mediaType: 'text/csv' },
    });
    const plan = begin.body as { fileId: string; partSizeBytes: number; parts: { partNumber: number; url: string }[] };
    fileId = plan.fileId;
    for (const part of plan.parts) {
      const chunk = CSV.subarray((part.partNumber - 1) * plan.partSizeBytes, part.partNumber * plan.partSizeBytes);
      expect((await fetch(part.url, { method: 'PUT', body: new Uint8Array(chunk) })).status).toBe(200);
    }
    await call(uploadStatusRoute, 'get', '/uploads/{fileId}', `/uploads/${fileId}`, params({ fileId }));
    const done = await call(completeRoute, 'post', '/uploads/{fileId}/complete', `/uploads/${fileId}/complete`, params({ fileId }));
    expect((done.body as { file: { sha256: string; uploadState: string } }).file).toMatchObject({ sha256: CSV_SHA256, uploadState: 'verified' });
    await call(updateFileRoute, 'patch', '/files/{fileId}', `/files/${fileId}`, params({ fileId }), { body: { role: 'raw' } });
    await call(analysisRoute, 'get', '/files/{fileId}/analysis', `/files/${fileId}/analysis`, params({ fileId }));
  });

  it('saves the record (incomplete, then complete) and reads the version', async () => {
    const partial = await call(metadataRoute, 'put', '/versions/{versionId}/metadata', `/versions/${versionId}/metadata`, params({ versionId }), { body: { title: 'Only a title so far' } });
    expect((partial.body as { complete: boolean }).complete).toBe(false);
    const wrong = await call(metadataRoute, 'put', '/versions/{versionId}/metadata', `/versions/${versionId}/metadata`, params({ versionId }), {
      body: { title: 'A negative length', sample: { name: 'X', geometry: { width: { value: -1, unit: 'mm' } } } },
    });
    expect(wrong.res.status).toBe(422);
    const full = await call(metadataRoute, 'put', '/versions/{versionId}/metadata', `/versions/${versionId}/metadata`, params({ versionId }), { body: completeRecord('R(T) of an OpenAPI-check copper wire') });
    expect((full.body as { complete: boolean }).complete).toBe(true);
    const view = await call(versionRoute, 'get', '/versions/{versionId}', `/versions/${versionId}`, params({ versionId }));
    expect((view.body as { files: { id: string }[] }).files.map((f) => f.id)).toEqual([fileId]);
  });

  it('shares a reviewer link, submits, publishes, cites and packages the version', async () => {
    const link = await call(createLinkRoute, 'post', '/versions/{versionId}/reviewer-links', `/versions/${versionId}/reviewer-links`, params({ versionId }), { body: { label: 'Referee 1 (OpenAPI check)' } });
    await call(listLinksRoute, 'get', '/versions/{versionId}/reviewer-links', `/versions/${versionId}/reviewer-links`, params({ versionId }));
    await call(accessLogRoute, 'get', '/versions/{versionId}/reviewer-links/access-log', `/versions/${versionId}/reviewer-links/access-log`, params({ versionId }));
    const linkId = (link.body as { link: { id: string } }).link.id;
    await call(revokeLinkRoute, 'delete', '/reviewer-links/{linkId}', `/reviewer-links/${linkId}`, params({ linkId }));

    await call(submitRoute, 'post', '/versions/{versionId}/submit', `/versions/${versionId}/submit`, params({ versionId }));
    const published = await call(publishRoute, 'post', '/versions/{versionId}/publish', `/versions/${versionId}/publish`, params({ versionId }), { body: { embargoUntil: null } });
    expect((published.body as { state: string }).state).toBe('published');
    const bibtex = await call(citationRoute, 'get', '/versions/{versionId}/citation', `/versions/${versionId}/citation?format=bibtex`, params({ versionId }));
    expect(Buffer.from(bibtex.body as ArrayBuffer).toString('utf8')).toMatch(/^@/);
    await call(dataciteRoute, 'get', '/versions/{versionId}/datacite', `/versions/${versionId}/datacite`, params({ versionId }));
    const zip = await call(packageRoute, 'get', '/versions/{versionId}/package', `/versions/${versionId}/package`, params({ versionId }));
    expect(zip.res.status).toBe(200); // the first download of a version builds the package (later ones may redirect to the cached copy)
    expect(Buffer.from(zip.body as ArrayBuffer).subarray(0, 2).toString('latin1')).toBe('PK');

    const next = await call(newVersionRoute, 'post', '/versions/{versionId}/new-version', `/versions/${versionId}/new-version`, params({ versionId }));
    expect((next.body as { versionNumber: number; fileCount: number })).toMatchObject({ versionNumber: 2, fileCount: 1 });
    await call(withdrawRoute, 'post', '/versions/{versionId}/withdraw', `/versions/${versionId}/withdraw`, params({ versionId }), { body: { reason: 'Checked by the OpenAPI test; not real data.' } });
  });

  it('reads groups, members, invitations, the audit log and the compare basket', async () => {
    const slug = lab.slug;
    await call(groupsRoute, 'get', '/groups', '/groups', {});
    const group = await call(groupRoute, 'get', '/groups/{slug}', `/groups/${slug}`, params({ slug }));
    expect((group.body as { storage: unknown }).storage).not.toBeNull();
    await call(membersRoute, 'get', '/groups/{slug}/members', `/groups/${slug}/members`, params({ slug }));
    const invited = await call(inviteRoute, 'post', '/groups/{slug}/invitations', `/groups/${slug}/invitations`, params({ slug }), {
      body: { email: `openapi-${randomBytes(4).toString('hex')}@tests.ohmstead.example`, role: 'member' },
    });
    await call(invitationsRoute, 'get', '/groups/{slug}/invitations', `/groups/${slug}/invitations`, params({ slug }));
    const invitationId = (invited.body as { invitation: { id: string } }).invitation.id;
    await call(revokeInvitationRoute, 'delete', '/groups/{slug}/invitations/{invitationId}', `/groups/${slug}/invitations/${invitationId}`, params({ slug, invitationId }));
    const audit = await call(auditRoute, 'get', '/audit', `/audit?group=${slug}`, {});
    expect((audit.body as { total: number }).total).toBeGreaterThan(0);
    await call(basketRoute, 'get', '/compare/items', '/compare/items', {});
  });

  it('answers refusals with the documented Error body and status', async () => {
    const bad = await call(draftsRoute, 'get', '/drafts', '/drafts', {}, { bearer: `ohm_${'Q'.repeat(43)}` });
    expect(bad.res.status).toBe(401);
    const scope = await call(createDatasetRoute, 'post', '/datasets', '/datasets', {}, { bearer: readOnly, body: { group: lab.slug, title: 'x' } });
    expect((scope.body as { error: { details: unknown } }).error.details).toEqual({ requiredScope: 'deposit' });
    const sessionOnly = await call(tokensRoute, 'get', '/tokens', '/tokens', {});
    expect(sessionOnly.res.status).toBe(403);
    const missing = await call(versionRoute, 'get', '/versions/{versionId}', '/versions/00000000-0000-4000-8000-000000000000', params({ versionId: '00000000-0000-4000-8000-000000000000' }));
    expect(missing.res.status).toBe(404);
    const invalid = await call(createDatasetRoute, 'post', '/datasets', '/datasets', {}, { body: { group: lab.slug } });
    expect((invalid.body as { error: { code: string; details: { fieldErrors: Record<string, string> } } }).error).toMatchObject({ code: 'validation_failed', details: { fieldErrors: { title: expect.any(String) } } });
  });
});
