import 'server-only';
import type { SiteRole } from '@/lib/access';
import { findTokenByHash, touchLastUsed } from './repo';
import { parseScopes, type TokenScope } from './scopes';
import { hashesEqual, hashToken, looksLikeToken } from './token-secret';

export type TokenPrincipal = {
  user: { id: string; email: string; name: string; siteRole: SiteRole };
  tokenId: string;
  scopes: TokenScope[];
};

export type TokenRefusal = 'malformed' | 'unknown' | 'revoked' | 'expired' | 'account_disabled';
export type TokenCheck = { ok: true; principal: TokenPrincipal } | { ok: false; reason: TokenRefusal };

/** last_used_at is written at most once a minute per token, so busy scripts do not write on every request. */
export const LAST_USED_GAP_MS = 60_000;

export const REFUSAL_MESSAGES: Record<TokenRefusal, string> = {
  malformed: 'The Authorization header does not carry an Ohmstead API token (expected "Bearer ohm_…").',
  unknown: 'This API token is not recognised. Check that it was copied whole, or create a new one in Settings → API tokens.',
  revoked: 'This API token was revoked. Create a new one in Settings → API tokens.',
  expired: 'This API token has expired. Create a new one in Settings → API tokens.',
  account_disabled: 'The account this API token belongs to is disabled.',
};

/** Checks a presented token against its stored SHA-256 and its state; on success notes when it was last used. */
export async function authenticateToken(presented: string, now = new Date()): Promise<TokenCheck> {
  if (!looksLikeToken(presented)) return { ok: false, reason: 'malformed' };
  const hash = hashToken(presented);
  const row = await findTokenByHash(hash);
  // The index look-up finds the row; the constant-time compare keeps the final check free of early exits.
  if (!row || !hashesEqual(row.token_hash, hash)) return { ok: false, reason: 'unknown' };
  if (row.revoked_at) return { ok: false, reason: 'revoked' };
  if (row.expires_at && new Date(row.expires_at).getTime() <= now.getTime()) return { ok: false, reason: 'expired' };
  if (row.user_disabled_at) return { ok: false, reason: 'account_disabled' };
  if (!row.last_used_at || now.getTime() - new Date(row.last_used_at).getTime() >= LAST_USED_GAP_MS) {
    await touchLastUsed(row.id, now, LAST_USED_GAP_MS);
  }
  return {
    ok: true,
    principal: {
      user: { id: row.user_id, email: row.user_email, name: row.user_name, siteRole: row.user_site_role },
      tokenId: row.id,
      scopes: parseScopes(row.scopes),
    },
  };
}
