'use client';

import { signIn, signOut } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export type EmailSignInButtonProps = { email: string; callbackUrl: string };

/** Mails a one-time sign-in link to the invited address that comes back to the invitation. */
export function EmailSignInButton({ email, callbackUrl }: EmailSignInButtonProps) {
  const [busy, setBusy] = useState(false);
  return (
    <Button type="button" disabled={busy} onClick={async () => { setBusy(true); await signIn('email', { email, callbackUrl }); }}>
      {busy ? 'Sending…' : 'E-mail me a sign-in link'}
    </Button>
  );
}

/** Signs out and comes back here, to sign in with the invited address. */
export function SignOutToSwitch({ callbackUrl }: { callbackUrl: string }) {
  return <Button type="button" variant="secondary" onClick={() => signOut({ callbackUrl })}>Sign out</Button>;
}
