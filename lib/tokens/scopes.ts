// What a personal access token may do. Browser sessions hold every scope; a token holds the ones chosen at creation.
export const TOKEN_SCOPES = ['read', 'deposit', 'publish', 'admin'] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];

export const SCOPE_DESCRIPTIONS: Record<TokenScope, string> = {
  read: 'Read drafts, files and records you can see',
  deposit: 'Create datasets, upload files, edit drafts, submit for review',
  publish: 'Publish, return and withdraw versions (where your group role allows it)',
  admin: 'Site administration routes (only useful to site admins); includes every other scope',
};

// Writing implies reading what you write; admin implies everything.
const IMPLIED: Record<TokenScope, TokenScope[]> = {
  read: ['read'],
  deposit: ['deposit', 'read'],
  publish: ['publish', 'read'],
  admin: ['admin', 'publish', 'deposit', 'read'],
};

export function isTokenScope(value: unknown): value is TokenScope {
  return typeof value === 'string' && (TOKEN_SCOPES as readonly string[]).includes(value);
}

export function hasScope(granted: readonly TokenScope[], needed: TokenScope): boolean {
  return granted.some((g) => IMPLIED[g].includes(needed));
}

/** Scopes as stored (a JSON array, possibly as text), unknown entries dropped, in canonical order. */
export function parseScopes(stored: unknown): TokenScope[] {
  let list: unknown = stored;
  if (typeof stored === 'string') {
    try {
      list = JSON.parse(stored);
    } catch {
      return [];
    }
  }
  return Array.isArray(list) ? TOKEN_SCOPES.filter((s) => list.includes(s)) : [];
}

// Curation transitions need 'publish'; site administration needs 'admin'.
const PUBLISH_PATH = /^\/api\/v1\/versions\/[^/]+\/(publish|withdraw|return)\/?$/;
const ADMIN_PATH = /^\/api\/v1\/admin(\/|$)/;

/**
 * The scope a token needs for a request to an /api/v1 route: reads need 'read', every other method 'deposit',
 * curation transitions 'publish', admin routes 'admin'. Applied to every route in userFromRequest, so a route
 * added later is covered without remembering to check; routes may ask for more with requireScope().
 */
export function scopeForRequest(method: string, pathname: string): TokenScope {
  if (ADMIN_PATH.test(pathname)) return 'admin';
  const m = method.toUpperCase();
  if (m === 'GET' || m === 'HEAD' || m === 'OPTIONS') return 'read';
  return PUBLISH_PATH.test(pathname) ? 'publish' : 'deposit';
}
