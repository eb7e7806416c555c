import 'server-only';
import { getServerSession, type Session } from 'next-auth';
import { AppError } from '@/lib/errors';
import { authOptions } from './options';

export type SessionUser = Session['user'];

export async function currentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions());
  return session?.user?.id ? session.user : null;
}

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new AppError('not_signed_in', 'Sign in to continue.');
  return user;
}
