import 'server-only';
import { currentUser, type SessionUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';

/** Who is calling an API route. `via` tells a browser session from a personal access token (Bearer, issue "API tokens"). */
export type RequestUser = SessionUser & { via: 'session' | 'token' };

/**
 * The signed-in user behind a request, or null. Every `/api/v1` route goes through here, so adding
 * `Authorization: Bearer` tokens later changes this one function, not the routes.
 */
export async function userFromRequest(req: Request): Promise<RequestUser | null> {
  void req; // the Bearer branch reads req.headers; sessions come from the cookie through next-auth
  const user = await currentUser();
  return user ? { ...user, via: 'session' } : null;
}

export async function requireRequestUser(req: Request): Promise<RequestUser> {
  const user = await userFromRequest(req);
  if (!user) throw new AppError('not_signed_in', 'Sign in (or send an API token) to use this route.');
  return user;
}
