import 'server-only';
import { db } from '@/lib/db';
import type { SiteRole } from '@/lib/access';

export type TokenRow = {
  id: string;
  user_id: string;
  name: string;
  token_prefix: string;
  scopes: unknown;
  expires_at: Date | null;
  last_used_at: Date | null;
  revoked_at: Date | null;
  created_at: Date;
};

/** A token with the account it belongs to, for authenticating a request. */
export type TokenWithUser = TokenRow & {
  token_hash: string;
  user_email: string;
  user_name: string;
  user_site_role: SiteRole;
  user_disabled_at: Date | null;
};

const LIST_COLUMNS = ['id', 'user_id', 'name', 'token_prefix', 'scopes', 'expires_at', 'last_used_at', 'revoked_at', 'created_at'];

export async function insertToken(row: {
  id: string; userId: string; name: string; tokenPrefix: string; tokenHash: string; scopes: string[]; expiresAt: Date | null; createdAt: Date;
}): Promise<void> {
  await db()('api_tokens').insert({
    id: row.id, user_id: row.userId, name: row.name, token_prefix: row.tokenPrefix, token_hash: row.tokenHash,
    scopes: JSON.stringify(row.scopes), expires_at: row.expiresAt, created_at: row.createdAt,
  });
}

export async function findTokenByHash(tokenHash: string): Promise<TokenWithUser | undefined> {
  return db()('api_tokens as t')
    .join('users as u', 'u.id', 't.user_id')
    .where('t.token_hash', tokenHash)
    .first(
      ...LIST_COLUMNS.map((c) => `t.${c}`), 't.token_hash',
      'u.email as user_email', 'u.name as user_name', 'u.site_role as user_site_role', 'u.disabled_at as user_disabled_at',
    );
}

export async function listTokenRows(userId: string): Promise<TokenRow[]> {
  return db()('api_tokens').where({ user_id: userId }).orderBy([{ column: 'created_at', order: 'desc' }, { column: 'id' }]).select(LIST_COLUMNS);
}

export async function findTokenRow(userId: string, tokenId: string): Promise<TokenRow | undefined> {
  return db()('api_tokens').where({ id: tokenId, user_id: userId }).first(LIST_COLUMNS);
}

/** Tokens that still work (not revoked, not expired) — for the per-user cap. */
export async function countUsableTokens(userId: string, now: Date): Promise<number> {
  const row = await db()('api_tokens')
    .where({ user_id: userId })
    .whereNull('revoked_at')
    .where((q) => q.whereNull('expires_at').orWhere('expires_at', '>', now))
    .count({ n: '*' })
    .first();
  return Number(row?.n ?? 0);
}

/** Marks a token revoked once; returns false when it was already revoked (or is not the user's). */
export async function markRevoked(userId: string, tokenId: string, now: Date): Promise<boolean> {
  const n = await db()('api_tokens').where({ id: tokenId, user_id: userId }).whereNull('revoked_at').update({ revoked_at: now });
  return n > 0;
}

/** Sets last_used_at unless it was set less than `minGapMs` ago (one write a minute at most per token). */
export async function touchLastUsed(tokenId: string, now: Date, minGapMs: number): Promise<void> {
  await db()('api_tokens')
    .where({ id: tokenId })
    .where((q) => q.whereNull('last_used_at').orWhere('last_used_at', '<', new Date(now.getTime() - minGapMs)))
    .update({ last_used_at: now });
}
