// Bearer tokens through real /api/v1 route handlers (route() → userFromRequest → lib operation), and the rate limits.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GET as listDraftsRoute } from '@/app/api/v1/drafts/route';
import { POST as createDatasetRoute } from '@/app/api/v1/datasets/route';
import { POST as publishRoute } from '@/app/api/v1/versions/[versionId]/publish/route';
import { GET as listTokensRoute, POST as createTokenRoute } from '@/app/api/v1/tokens/route';
import { db } from '@/lib/db';
import { recordHit, resetLimit, type RateLimit } from '@/lib/rate-limit/rate-limit';
import { API_PER_IP_ANONYMOUS, API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import { createToken, type CreatedToken } from '@/lib/tokens/create-token';
import { revokeToken } from '@/lib/tokens/revoke-token';
import { awayFromWindowEdge, makeTokenLab, removeTokenLab, type TokenLab } from './fixtures';

let lab: TokenLab;
const cleanup: (() => Promise<void>)[] = [];
// Documentation-range addresses (RFC 5737) tagged per run; only ever header values here. The IP-limit test has its
// own, since the 401 answers of other tests count against the address they came from.
const runTag = randomBytes(3).toString('hex');
const ip = `203.0.113.10-${runTag}`;
const limitedIp = `203.0.113.11-${runTag}`;

beforeAll(async () => {
  lab = await makeTokenLab();
});
afterAll(async () => {
  await resetLimit(API_PER_IP_ANONYMOUS, ip);
  for (const c of cleanup) await c();
  await removeTokenLab(lab);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

function call(token: string | null, method: string, path: string, body?: unknown, from = ip): Request {
  const headers: Record<string, string> = { 'x-forwarded-for': from };
  if (token !== null) headers.authorization = `Bearer ${token}`;
  if (body !== undefined) headers['content-type'] = 'application/json';
  return new Request(`http://localhost${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
}

async function token(scopes: string[]): Promise<CreatedToken> {
  const created = await createToken({ id: lab.member.id, via: 'session' }, { name: `route test ${scopes.join('+')}`, scopes });
  cleanup.push(() => resetLimit(API_PER_TOKEN, created.id));
  return created;
}

/** Counts n earlier requests in the current window, ten at a time (the pool holds ten connections). */
async function hits(limit: RateLimit, key: string, n: number): Promise<void> {
  for (let i = 0; i < n; i += 10) await Promise.all(Array.from({ length: Math.min(10, n - i) }, () => recordHit(limit, key)));
}

type ErrorBody = { error: { code: string; message: string; details?: Record<string, unknown> } };

describe('Authorization: Bearer on /api/v1 routes', () => {
  it('GET /api/v1/drafts lists the token owner’s group drafts', async () => {
    const t = await token(['read']);
    const res = await listDraftsRoute(call(t.token, 'GET', '/api/v1/drafts'), {});
    expect(res.status).toBe(200);
    const body = (await res.json()) as { drafts: { versionId: string; title: string }[] };
    expect(body.drafts.map((d) => d.versionId)).toEqual([lab.draftVersionId]);
    expect(body.drafts[0]?.title).toBe(lab.draftTitle);
  });

  it('answers 401 with the reason for a revoked or unknown token (never falls back to anonymous)', async () => {
    const t = await token(['read']);
    await revokeToken({ id: lab.member.id }, t.id);
    const revoked = await listDraftsRoute(call(t.token, 'GET', '/api/v1/drafts'), {});
    expect(revoked.status).toBe(401);
    expect(((await revoked.json()) as ErrorBody).error.message).toBe('This API token was revoked. Create a new one in Settings → API tokens.');
    const unknown = await listDraftsRoute(call(`ohm_${'Z'.repeat(43)}`, 'GET', '/api/v1/drafts'), {});
    expect(unknown.status).toBe(401);
    expect(((await unknown.json()) as ErrorBody).error.code).toBe('not_signed_in');
  });

  it('needs "deposit" to write and "publish" to publish (403 names the scope)', async () => {
    const reader = await token(['read']);
    const write = await createDatasetRoute(call(reader.token, 'POST', '/api/v1/datasets', { group: 'nowhere', title: 'x' }), {});
    expect(write.status).toBe(403);
    expect(((await write.json()) as ErrorBody).error.details).toEqual({ requiredScope: 'deposit' });

    const depositor = await token(['deposit']);
    const ctx = { params: Promise.resolve({ versionId: lab.draftVersionId }) };
    const publish = await publishRoute(call(depositor.token, 'POST', `/api/v1/versions/${lab.draftVersionId}/publish`, {}), ctx);
    expect(publish.status).toBe(403);
    expect(((await publish.json()) as ErrorBody).error.details).toEqual({ requiredScope: 'publish' });
    expect((await db()('dataset_versions').where({ id: lab.draftVersionId }).first('state')).state).toBe('draft');
  });

  it('cannot list or mint tokens: those routes are for browser sessions', async () => {
    const admin = await token(['admin']);
    const list = await listTokensRoute(call(admin.token, 'GET', '/api/v1/tokens'), {});
    expect(list.status).toBe(403);
    const mint = await createTokenRoute(call(admin.token, 'POST', '/api/v1/tokens', { name: 'child', scopes: ['read'] }), {});
    expect(mint.status).toBe(403);
    expect(await db()('api_tokens').where({ user_id: lab.member.id, name: 'child' }).first()).toBeUndefined();
  });
});

describe('rate limits', () => {
  it('answer 429 with Retry-After once a token has made 600 requests in its minute', async () => {
    const t = await token(['read']);
    await awayFromWindowEdge();
    await hits(API_PER_TOKEN, t.id, API_PER_TOKEN.max - 1);
    const last = await listDraftsRoute(call(t.token, 'GET', '/api/v1/drafts'), {});
    expect(last.status).toBe(200); // the 600th request of the minute is still allowed
    const over = await listDraftsRoute(call(t.token, 'GET', '/api/v1/drafts'), {});
    expect(over.status).toBe(429);
    const retry = Number(over.headers.get('retry-after'));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(60);
    const body = (await over.json()) as ErrorBody;
    expect(body.error.code).toBe('rate_limited');
    expect(body.error.details).toEqual({ retryAfterSeconds: retry, limit: 600 });
    // Another token of the same user has its own budget.
    const other = await token(['read']);
    expect((await listDraftsRoute(call(other.token, 'GET', '/api/v1/drafts'), {})).status).toBe(200);
  });

  it('count bad tokens against the caller’s address: 120 a minute, then 429 instead of 401', async () => {
    cleanup.push(() => resetLimit(API_PER_IP_ANONYMOUS, limitedIp));
    await awayFromWindowEdge();
    await hits(API_PER_IP_ANONYMOUS, limitedIp, API_PER_IP_ANONYMOUS.max - 1);
    const guess = `ohm_${randomBytes(32).toString('base64url')}`;
    expect((await listDraftsRoute(call(guess, 'GET', '/api/v1/drafts', undefined, limitedIp), {})).status).toBe(401);
    const limited = await listDraftsRoute(call(guess, 'GET', '/api/v1/drafts', undefined, limitedIp), {});
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
  });
});
