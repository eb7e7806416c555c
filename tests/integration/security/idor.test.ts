// IDOR: a signed-in outsider (another group's member, with an API token holding read, deposit and publish) sends the
// ids of a group's draft, its file and its reviewer link through every route that takes one. Each answer must be the
// same 404 an unknown id gets, so an id leaks neither existence nor content; nothing may change underneath.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as analysis from '@/app/api/v1/files/[fileId]/analysis/route';
import * as curve from '@/app/api/v1/files/[fileId]/curve/route';
import * as download from '@/app/api/v1/files/[fileId]/download/route';
import * as file from '@/app/api/v1/files/[fileId]/route';
import * as linkSend from '@/app/api/v1/reviewer-links/[linkId]/send/route';
import * as link from '@/app/api/v1/reviewer-links/[linkId]/route';
import * as uploadComplete from '@/app/api/v1/uploads/[fileId]/complete/route';
import * as upload from '@/app/api/v1/uploads/[fileId]/route';
import * as citation from '@/app/api/v1/versions/[versionId]/citation/route';
import * as datacite from '@/app/api/v1/versions/[versionId]/datacite/route';
import * as metadata from '@/app/api/v1/versions/[versionId]/metadata/route';
import * as newVersion from '@/app/api/v1/versions/[versionId]/new-version/route';
import * as pkg from '@/app/api/v1/versions/[versionId]/package/route';
import * as publish from '@/app/api/v1/versions/[versionId]/publish/route';
import * as returnRoute from '@/app/api/v1/versions/[versionId]/return/route';
import * as accessLog from '@/app/api/v1/versions/[versionId]/reviewer-links/access-log/route';
import * as links from '@/app/api/v1/versions/[versionId]/reviewer-links/route';
import * as version from '@/app/api/v1/versions/[versionId]/route';
import * as submit from '@/app/api/v1/versions/[versionId]/submit/route';
import * as uploads from '@/app/api/v1/versions/[versionId]/uploads/route';
import * as withdraw from '@/app/api/v1/versions/[versionId]/withdraw/route';
import { db } from '@/lib/db';
import { resetLimit } from '@/lib/rate-limit/rate-limit';
import { API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import { createToken } from '@/lib/tokens/create-token';
import { makeTokenLab, removeTokenLab, type TokenLab } from '../tokens/fixtures';

// Each route names its own params type; `never` accepts them all, and call() builds the params the case names.
type Handler = (req: Request, ctx: never) => Promise<Response>;
type Case = { name: string; handler: Handler; method: string; param: 'versionId' | 'fileId' | 'linkId'; body?: unknown; query?: string };

const CASES: Case[] = [
  { name: 'GET version', handler: version.GET, method: 'GET', param: 'versionId' },
  { name: 'GET citation', handler: citation.GET, method: 'GET', param: 'versionId' },
  { name: 'GET datacite', handler: datacite.GET, method: 'GET', param: 'versionId' },
  { name: 'PUT metadata', handler: metadata.PUT, method: 'PUT', param: 'versionId', body: { title: 'Overwritten by an outsider' } },
  { name: 'POST new-version', handler: newVersion.POST, method: 'POST', param: 'versionId', body: {} },
  { name: 'GET package', handler: pkg.GET, method: 'GET', param: 'versionId' },
  { name: 'POST publish', handler: publish.POST, method: 'POST', param: 'versionId', body: {} },
  { name: 'POST return', handler: returnRoute.POST, method: 'POST', param: 'versionId', body: { comment: 'Please add the contact geometry.' } },
  { name: 'POST submit', handler: submit.POST, method: 'POST', param: 'versionId', body: {} },
  { name: 'POST withdraw', handler: withdraw.POST, method: 'POST', param: 'versionId', body: { reason: 'x' } },
  { name: 'GET reviewer-links', handler: links.GET, method: 'GET', param: 'versionId' },
  { name: 'POST reviewer-links', handler: links.POST, method: 'POST', param: 'versionId', body: { label: 'Referee 2' } },
  { name: 'GET reviewer-links access-log', handler: accessLog.GET, method: 'GET', param: 'versionId' },
  { name: 'POST uploads', handler: uploads.POST, method: 'POST', param: 'versionId', body: { name: 'x.csv', sizeBytes: 10 } },
  { name: 'GET file analysis', handler: analysis.GET, method: 'GET', param: 'fileId' },
  { name: 'GET file curve', handler: curve.GET, method: 'GET', param: 'fileId', query: '?x=T&y=R' },
  { name: 'GET file download', handler: download.GET, method: 'GET', param: 'fileId' },
  { name: 'PATCH file', handler: file.PATCH, method: 'PATCH', param: 'fileId', body: { role: 'other' } },
  { name: 'DELETE file', handler: file.DELETE, method: 'DELETE', param: 'fileId' },
  { name: 'GET upload', handler: upload.GET, method: 'GET', param: 'fileId' },
  { name: 'DELETE upload', handler: upload.DELETE, method: 'DELETE', param: 'fileId' },
  { name: 'POST upload complete', handler: uploadComplete.POST, method: 'POST', param: 'fileId', body: {} },
  { name: 'DELETE reviewer link', handler: link.DELETE, method: 'DELETE', param: 'linkId' },
  { name: 'POST reviewer link send', handler: linkSend.POST, method: 'POST', param: 'linkId', body: { email: 'referee@example.test', token: 'a-guessed-token' } },
];

let lab: TokenLab;
let secret: string;
let tokenId: string;
const ids = { versionId: '', fileId: randomUUID(), linkId: randomUUID() };

beforeAll(async () => {
  lab = await makeTokenLab();
  ids.versionId = lab.draftVersionId;
  await db()('files').insert({ id: ids.fileId, version_id: lab.draftVersionId, name: 'r-vs-t.csv', size_bytes: 12, upload_state: 'pending', created_by: lab.member.id });
  await db()('reviewer_links').insert({
    id: ids.linkId, version_id: lab.draftVersionId, label: 'Referee 1', token_hash: randomUUID().replace(/-/g, '').padEnd(64, '0'),
    expires_at: new Date(Date.now() + 7 * 86_400_000), created_by: lab.member.id,
  });
  const created = await createToken({ id: lab.outsider.id, via: 'session' }, { name: 'idor probe', scopes: ['read', 'deposit', 'publish'] });
  secret = created.token;
  tokenId = created.id;
});

afterAll(async () => {
  await resetLimit(API_PER_TOKEN, tokenId);
  await removeTokenLab(lab);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

function call(c: Case, id: string): Promise<Response> {
  const path = `/api/v1/ids/${id}${c.query ?? ''}`;
  const init: RequestInit = { method: c.method, headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json', 'x-forwarded-for': '203.0.113.40' } };
  if (c.body !== undefined) init.body = JSON.stringify(c.body);
  return c.handler(new Request(`http://localhost${path}`, init), { params: Promise.resolve({ [c.param]: id }) } as never);
}

type ErrorBody = { error: { code: string; message: string } };

describe('another group’s ids through every id-taking route', () => {
  it.each(CASES)('$name answers 404 exactly as for an unknown id', async (c) => {
    const foreign = await call(c, ids[c.param]);
    const unknown = await call(c, randomUUID());
    expect(unknown.status).toBe(404);
    expect(foreign.status).toBe(404);
    const [a, b] = [((await foreign.json()) as ErrorBody).error, ((await unknown.json()) as ErrorBody).error];
    expect(a.code).toBe('not_found');
    expect(a.message).toBe(b.message);
  });

  it('left the draft, its file and its reviewer link exactly as they were', async () => {
    const draft = await db()('dataset_versions').where({ id: lab.draftVersionId }).first();
    expect(draft).toMatchObject({ state: 'draft', title: lab.draftTitle });
    expect(await db()('files').where({ version_id: lab.draftVersionId }).pluck('id')).toEqual([ids.fileId]);
    expect(await db()('reviewer_links').where({ version_id: lab.draftVersionId }).pluck('id')).toEqual([ids.linkId]);
    expect((await db()('reviewer_links').where({ id: ids.linkId }).first()).revoked_at).toBeNull();
  });
});
