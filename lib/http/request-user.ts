import 'server-only';
import { currentUser, type SessionUser } from '@/lib/auth/session';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { clientAddress } from '@/lib/http/client-address';
import { CROSS_SITE_MESSAGE, isCrossSiteMutation } from '@/lib/http/cross-site';
import { API_PER_IP_ANONYMOUS, API_PER_TOKEN, enforceRateLimit } from '@/lib/tokens/api-rate-limit';
import { authenticateToken, REFUSAL_MESSAGES } from '@/lib/tokens/authenticate-token';
import { hasScope, scopeForRequest, type TokenScope } from '@/lib/tokens/scopes';

/**
 * Who is calling an API route. `via` tells a browser session from a personal access token (Authorization: Bearer);
 * token callers carry the token's scopes and id, session callers hold every scope.
 */
export type RequestUser = SessionUser & { via: 'session' | 'token'; scopes?: TokenScope[]; tokenId?: string };

/** The caller's address for per-IP limits (see client-address.ts for which X-Forwarded-For entry is trusted). */
export function requestIp(req: Request): string {
  return clientAddress(req.headers) ?? 'unknown';
}

/** Session users hold every scope; a token must hold `scope` (or one that implies it), else 403. */
export function requireScope(user: RequestUser, scope: TokenScope): void {
  if (user.via === 'session') return;
  if (!hasScope(user.scopes ?? [], scope)) {
    throw new AppError('forbidden', `This API token does not have the "${scope}" scope. Create a token with it in Settings → API tokens.`, {
      requiredScope: scope,
    });
  }
}

/** For routes only a browser session may use (e.g. managing tokens): a token caller gets 403. */
export function requireSessionUser(user: RequestUser): void {
  if (user.via !== 'session') throw new AppError('forbidden', 'This route needs a signed-in browser session; API tokens cannot use it.');
}

/**
 * The signed-in user behind a request, or null. Every `/api/v1` route goes through here: a Bearer token is checked
 * (state, per-token rate limit, the scope the method and path need), else the next-auth session cookie; anonymous
 * callers and bad tokens count against a per-IP limit. Session-cookie changes from another origin get 403 (CSRF).
 */
export async function userFromRequest(req: Request): Promise<RequestUser | null> {
  const authorization = req.headers.get('authorization');
  if (authorization !== null) {
    const presented = /^Bearer\s+(\S+)\s*$/i.exec(authorization)?.[1] ?? '';
    const check = await authenticateToken(presented);
    if (!check.ok) {
      await enforceRateLimit(API_PER_IP_ANONYMOUS, requestIp(req));
      throw new AppError('not_signed_in', REFUSAL_MESSAGES[check.reason]);
    }
    const { user, tokenId, scopes } = check.principal;
    await enforceRateLimit(API_PER_TOKEN, tokenId);
    const caller: RequestUser = { ...user, via: 'token', scopes, tokenId };
    requireScope(caller, scopeForRequest(req.method, new URL(req.url).pathname));
    return caller;
  }
  const user = await currentUser();
  if (user) {
    // CSRF: the session cookie rides along on any site's request, so a cookie-authenticated change must come from us.
    if (isCrossSiteMutation(req, new URL(env().NEXTAUTH_URL).origin)) throw new AppError('forbidden', CROSS_SITE_MESSAGE);
    return { ...user, via: 'session' };
  }
  await enforceRateLimit(API_PER_IP_ANONYMOUS, requestIp(req));
  return null;
}

export async function requireRequestUser(req: Request): Promise<RequestUser> {
  const user = await userFromRequest(req);
  if (!user) throw new AppError('not_signed_in', 'Sign in (or send an API token) to use this route.');
  return user;
}
