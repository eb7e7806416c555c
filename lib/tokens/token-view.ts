import type { TokenRow } from './repo';
import { parseScopes, type TokenScope } from './scopes';

/** A token as its owner sees it in lists: never the secret or its hash. Instants are ISO 8601 UTC. */
export type TokenView = {
  id: string;
  name: string;
  displayPrefix: string;
  scopes: TokenScope[];
  status: 'active' | 'expired' | 'revoked';
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
  createdAt: string;
};

const iso = (d: Date | string | null): string | null => (d ? new Date(d).toISOString() : null);

export function tokenStatus(row: Pick<TokenRow, 'revoked_at' | 'expires_at'>, now: Date): TokenView['status'] {
  if (row.revoked_at) return 'revoked';
  if (row.expires_at && new Date(row.expires_at).getTime() <= now.getTime()) return 'expired';
  return 'active';
}

export function toTokenView(row: TokenRow, now: Date): TokenView {
  return {
    id: row.id, name: row.name, displayPrefix: row.token_prefix, scopes: parseScopes(row.scopes), status: tokenStatus(row, now),
    expiresAt: iso(row.expires_at), lastUsedAt: iso(row.last_used_at), revokedAt: iso(row.revoked_at), createdAt: iso(row.created_at)!,
  };
}
