import type { ReactNode } from 'react';
import { currentUser } from '@/lib/auth/session';
import { SignInRequired } from './_auth/sign-in-required';

// Authoring pages need a signed-in user; each page also checks on its own (layouts are not re-run on every navigation).
export default async function AuthoringLayout({ children }: { children: ReactNode }) {
  const user = await currentUser();
  if (!user) return <SignInRequired />;
  return children;
}
