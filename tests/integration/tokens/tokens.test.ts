// Personal access tokens against the dev/test MariaDB: creation, hashing at rest, expiry, revocation, last use and audit.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { authenticateToken } from '@/lib/tokens/authenticate-token';
import { createToken } from '@/lib/tokens/create-token';
import { listTokens } from '@/lib/tokens/list-tokens';
import { revokeToken } from '@/lib/tokens/revoke-token';
import { makeTokenLab, removeTokenLab, type TokenLab } from './fixtures';

let lab: TokenLab;
const DAY = 24 * 60 * 60 * 1000;

beforeAll(async () => {
  lab = await makeTokenLab();
});
afterAll(async () => {
  await removeTokenLab(lab);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

describe('creating a token', () => {
  it('returns the secret once and stores only its SHA-256, the display prefix, scopes and expiry', async () => {
    const now = new Date('2026-12-02T10:00:00Z');
    const created = await createToken({ id: lab.member.id, via: 'session' }, { name: ' cryostat PC ', scopes: ['publish', 'read'], expiresInDays: 30 }, { now, ip: '192.0.2.7' });
    expect(created.token).toMatch(/^ohm_[A-Za-z0-9_-]{43}$/);
    expect(created).toMatchObject({ name: 'cryostat PC', scopes: ['read', 'publish'], status: 'active', displayPrefix: created.token.slice(0, 12) });
    expect(created.expiresAt).toBe('2027-01-01T10:00:00.000Z');
    const row = await db()('api_tokens').where({ id: created.id }).first();
    expect(row.token_hash).toBe(createHash('sha256').update(created.token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(created.token.slice(12));
    expect(row.token_prefix).toBe(created.token.slice(0, 12));
    const listed = await listTokens({ id: lab.member.id, via: 'session' });
    const mine = listed.find((t) => t.id === created.id)!;
    expect(mine).toEqual({ ...created, token: undefined, lastUsedAt: null, revokedAt: null, expiresAt: '2027-01-01T10:00:00.000Z' } as unknown as typeof mine);
    expect(JSON.stringify(listed)).not.toContain(created.token);
    const audit = await db()('audit_log').where({ action: 'token.created', target_id: created.id }).first();
    expect(audit.actor_user_id).toBe(lab.member.id);
    expect(audit.ip_hash).toBe(createHash('sha256').update('192.0.2.7').digest('hex'));
  });

  it('may have no expiry, but never one past a year', async () => {
    const forever = await createToken({ id: lab.member.id }, { name: 'no expiry', scopes: ['read'], expiresInDays: null });
    expect(forever.expiresAt).toBeNull();
    const tooLong = await refusal(createToken({ id: lab.member.id }, { name: 'too long', scopes: ['read'], expiresInDays: 366 }));
    expect(tooLong.code).toBe('validation_failed');
    expect(tooLong.details?.fieldErrors?.expiresInDays).toMatch(/must be <= 365\.$/);
  });

  it.each([
    [{ name: 'x', scopes: [] }, 'scopes'],
    [{ name: 'x', scopes: ['root'] }, 'scopes.0'],
    [{ name: '   ', scopes: ['read'] }, 'name'],
    [{ scopes: ['read'] }, 'name'],
  ])('refuses %j with a field error on %s', async (body, field) => {
    const before = await db()('api_tokens').where({ user_id: lab.member.id }).count({ n: '*' }).first();
    const error = await refusal(createToken({ id: lab.member.id }, body));
    expect(Object.keys(error.details?.fieldErrors ?? {})).toContain(field);
    const after = await db()('api_tokens').where({ user_id: lab.member.id }).count({ n: '*' }).first();
    expect(Number(after?.n)).toBe(Number(before?.n));
  });

  it('cannot be done with a token', async () => {
    const error = await refusal(createToken({ id: lab.member.id, via: 'token' }, { name: 'minted by a token', scopes: ['admin'] }));
    expect(error.code).toBe('forbidden');
    expect(await db()('api_tokens').where({ name: 'minted by a token' }).first()).toBeUndefined();
  });
});

describe('authenticating with a token', () => {
  it('knows the user and scopes, and writes last_used_at at most once a minute', async () => {
    const t0 = new Date(Date.now() + 1000);
    t0.setMilliseconds(0); // DATETIME keeps whole seconds
    const created = await createToken({ id: lab.member.id }, { name: 'last used', scopes: ['deposit'], expiresInDays: 7 });
    const first = await authenticateToken(created.token, t0);
    expect(first.ok && first.principal).toMatchObject({ tokenId: created.id, scopes: ['deposit'], user: { id: lab.member.id, name: 'Perrin Waddesdon', siteRole: 'user' } });
    const lastUsed = async () => (await db()('api_tokens').where({ id: created.id }).first('last_used_at')).last_used_at as Date;
    expect((await lastUsed()).toISOString()).toBe(t0.toISOString());
    await authenticateToken(created.token, new Date(t0.getTime() + 30_000));
    expect((await lastUsed()).toISOString()).toBe(t0.toISOString());
    await authenticateToken(created.token, new Date(t0.getTime() + 61_000));
    expect((await lastUsed()).toISOString()).toBe(new Date(t0.getTime() + 61_000).toISOString());
  });

  it('refuses an unknown, malformed, expired or revoked token', async () => {
    const created = await createToken({ id: lab.member.id }, { name: 'short lived', scopes: ['read'], expiresInDays: 1 });
    const expiresAt = new Date(created.expiresAt!).getTime();
    expect(await authenticateToken(created.token, new Date(expiresAt - 1000))).toMatchObject({ ok: true });
    expect(await authenticateToken(created.token, new Date(expiresAt + 1000))).toEqual({ ok: false, reason: 'expired' });
    expect(await authenticateToken(`ohm_${'A'.repeat(43)}`)).toEqual({ ok: false, reason: 'unknown' });
    expect(await authenticateToken(created.token.slice(0, -1))).toEqual({ ok: false, reason: 'malformed' });
    expect(await authenticateToken(`${created.token}' OR '1'='1`)).toEqual({ ok: false, reason: 'malformed' });
    const listed = (await listTokens({ id: lab.member.id }, new Date(expiresAt + DAY))).find((t) => t.id === created.id);
    expect(listed?.status).toBe('expired');
  });

  it('stops working the moment it is revoked; revoking is audited once and only by its owner', async () => {
    const created = await createToken({ id: lab.member.id }, { name: 'to revoke', scopes: ['read'] });
    expect((await authenticateToken(created.token)).ok).toBe(true);
    const notYours = await refusal(revokeToken({ id: lab.outsider.id }, created.id));
    expect(notYours.code).toBe('not_found');
    expect((await authenticateToken(created.token)).ok).toBe(true);
    const revoked = await revokeToken({ id: lab.member.id, via: 'session' }, created.id, { ip: '192.0.2.8' });
    expect(revoked.status).toBe('revoked');
    expect(await authenticateToken(created.token)).toEqual({ ok: false, reason: 'revoked' });
    await revokeToken({ id: lab.member.id }, created.id);
    const audits = await db()('audit_log').where({ action: 'token.revoked', target_id: created.id });
    expect(audits).toHaveLength(1);
    expect(audits[0].actor_user_id).toBe(lab.member.id);
    expect((await refusal(revokeToken({ id: lab.member.id, via: 'token' }, created.id))).code).toBe('forbidden');
    expect((await refusal(revokeToken({ id: lab.member.id }, 'not-a-uuid'))).code).toBe('not_found');
  });

  it('refuses a disabled account', async () => {
    const created = await createToken({ id: lab.outsider.id }, { name: 'disabled owner', scopes: ['read'] });
    await db()('users').where({ id: lab.outsider.id }).update({ disabled_at: new Date() });
    try {
      expect(await authenticateToken(created.token)).toEqual({ ok: false, reason: 'account_disabled' });
    } finally {
      await db()('users').where({ id: lab.outsider.id }).update({ disabled_at: null });
    }
  });
});
