import 'server-only';
import { redirect } from 'next/navigation';
import { currentUser, type SessionUser } from '@/lib/auth/session';

/** The signed-in user, or a redirect to sign-in that comes back to `callbackPath` afterwards. */
export async function requireSignedIn(callbackPath: string): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(callbackPath)}`);
  return user;
}
