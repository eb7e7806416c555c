// SQL-injection strings through every query parameter of the GET routes and the search and audit operations behind
// the pages: each answer is a normal result or a 4xx, never a 500; LIKE wildcards match literally; tables stay intact.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GET as auditRoute } from '@/app/api/v1/audit/route';
import { GET as compareCurvesRoute } from '@/app/api/v1/compare/curves/route';
import { DELETE as compareItemsDelete, GET as compareItemsRoute } from '@/app/api/v1/compare/items/route';
import { GET as draftsRoute } from '@/app/api/v1/drafts/route';
import { GET as groupsRoute } from '@/app/api/v1/groups/route';
import { GET as fileCurveRoute } from '@/app/api/v1/files/[fileId]/curve/route';
import { GET as versionRoute } from '@/app/api/v1/versions/[versionId]/route';
import { listAuditEntries, parseAuditQuery } from '@/lib/audit/list-audit';
import { db } from '@/lib/db';
import { listRecentPublished } from '@/lib/datasets/repo';
import { AppError } from '@/lib/errors';
import { resetLimit } from '@/lib/rate-limit/rate-limit';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import { createToken } from '@/lib/tokens/create-token';
import { makeTokenLab, removeTokenLab, type TokenLab } from '../tokens/fixtures';

const PAYLOADS = [
  "' OR 1=1 --",
  '"; DROP TABLE users; --',
  "'; DROP TABLE dataset_versions; --",
  "1' UNION SELECT email, password_hash FROM users --",
  '%',
  '_',
  '\\',
  "\\'",
  "') OR ('1'='1",
  '1; SELECT SLEEP(5)',
];

let lab: TokenLab;
let secret: string;
let tokenId: string;
let before: { tables: string[]; labUsers: number; labDraft: string | undefined };

/** The tables, and this run's own rows (other suites share the database, so global counts may move meanwhile). */
async function census() {
  const [rows] = (await db().raw('SHOW TABLES')) as [Record<string, string>[]];
  const [users] = await db()('users').whereIn('id', [lab.member.id, lab.outsider.id]).count({ n: '*' });
  const draft = await db()('dataset_versions').where({ id: lab.draftVersionId }).first('title');
  return { tables: rows.map((r) => Object.values(r)[0]!).sort(), labUsers: Number(users!.n), labDraft: draft?.title as string | undefined };
}

beforeAll(async () => {
  lab = await makeTokenLab();
  const created = await createToken({ id: lab.member.id, via: 'session' }, { name: 'sqli probe', scopes: ['read', 'deposit'] });
  secret = created.token;
  tokenId = created.id;
  before = await census();
});

afterAll(async () => {
  await resetLimit(API_PER_TOKEN, tokenId);
  await removeTokenLab(lab);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

const get = (path: string, method = 'GET') =>
  new Request(`http://localhost${path}`, { method, headers: { authorization: `Bearer ${secret}`, 'x-forwarded-for': '203.0.113.41' } });
const ctx = <T extends Record<string, string>>(params: T) => ({ params: Promise.resolve(params) });
const qs = (params: Record<string, string>) => `?${new URLSearchParams(params).toString()}`;

function expectHandled(res: Response, label: string): void {
  expect(res.status, label).not.toBe(500);
  expect(res.status === 200 || (res.status >= 400 && res.status < 500), `${label} → ${res.status}`).toBe(true);
}

describe.each(PAYLOADS)('payload %j', (payload) => {
  it('title search matches it literally (wildcards escaped)', async () => {
    const hits = await listRecentPublished(50, payload);
    for (const hit of hits) expect(hit.title).toContain(payload);
    // Check value: no demo title contains these characters, so a literal match finds nothing.
    expect(hits).toEqual([]);
  });

  it('the faceted search parser takes it as text and refuses it as a number (400)', () => {
    expect(parseSearchQuery(new URLSearchParams({ q: payload })).q).toBe(payload.trim());
    expect(() => parseSearchQuery(new URLSearchParams({ tMin: payload }))).toThrow();
  });

  it('every audit filter answers with entries or a 422, as a site admin sees it', async () => {
    for (const key of ['group', 'action', 'actor', 'targetType', 'targetId', 'from', 'to', 'page', 'pageSize']) {
      try {
        const page = await listAuditEntries({ viewer: { id: lab.member.id, siteRole: 'admin' }, query: parseAuditQuery(new URLSearchParams({ [key]: payload })) });
        // Only the free-text actor filter takes arbitrary text; it matches names literally, and no name holds these.
        expect(page.total, key).toBe(0);
      } catch (error) {
        expect(error, key).toBeInstanceOf(AppError);
        expect([404, 422], `${key}: ${(error as AppError).message}`).toContain((error as AppError).status);
      }
    }
  });

  it('GET routes answer normally or with a 4xx through every query and path parameter', async () => {
    const audit = await auditRoute(get(`/api/v1/audit${qs({ group: payload, actor: payload, action: payload })}`), {});
    expectHandled(audit, 'audit');
    expectHandled(await draftsRoute(get(`/api/v1/drafts${qs({ q: payload })}`), {}), 'drafts');
    const drafts = (await (await draftsRoute(get(`/api/v1/drafts${qs({ q: payload })}`), {})).json()) as { drafts: { versionId: string }[] };
    expect(drafts.drafts.map((d) => d.versionId)).toEqual([lab.draftVersionId]);
    expectHandled(await groupsRoute(get(`/api/v1/groups${qs({ q: payload })}`), {}), 'groups');
    expectHandled(await compareItemsRoute(get(`/api/v1/compare/items${qs({ id: payload })}`), {}), 'compare items');
    expectHandled(await compareItemsDelete(get(`/api/v1/compare/items${qs({ id: payload })}`, 'DELETE'), {}), 'compare items delete');
    expectHandled(await compareCurvesRoute(get(`/api/v1/compare/curves${qs({ curves: payload })}`), {}), 'compare curves');
    const refs = JSON.stringify([{ versionId: payload, fileId: payload, x: payload, y: payload }]);
    expectHandled(await compareCurvesRoute(get(`/api/v1/compare/curves${qs({ curves: refs })}`), {}), 'compare curves refs');
    expect((await versionRoute(get(`/api/v1/versions/x`), ctx({ versionId: payload }))).status).toBe(404);
    expect((await fileCurveRoute(get(`/api/v1/files/x/curve${qs({ x: payload, y: payload })}`), ctx({ fileId: payload }))).status).toBe(404);
  });
});

describe('after every payload', () => {
  it('keeps every table and this run’s users and draft', async () => {
    expect(before.tables).toEqual(expect.arrayContaining(['users', 'dataset_versions', 'files', 'audit_log']));
    expect(before).toMatchObject({ labUsers: 2, labDraft: lab.draftTitle });
    expect(await census()).toEqual(before);
  });
});
