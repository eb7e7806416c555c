'use client';

import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export type OrcidSignInButtonProps = { callbackUrl: string };

/** Sends the visitor to ORCID (or the local stand-in) and back; the first time, the iD is linked to their account. */
export function OrcidSignInButton({ callbackUrl }: OrcidSignInButtonProps) {
  const [busy, setBusy] = useState(false);
  return (
    <section aria-labelledby="orcid-heading" className="mt-8 flex flex-col gap-3 rounded-lg border border-slate-200 bg-white p-6 md:max-w-md">
      <h2 id="orcid-heading" className="font-semibold">With your ORCID iD</h2>
      <p className="text-sm text-slate-600">
        Researchers with an ORCID iD can sign in with it. The first time, we link it to the account with the same confirmed
        e-mail address, or open a new account; the iD then appears on your profile and as a creator in your deposits.
      </p>
      <Button
        type="button"
        variant="secondary"
        disabled={busy}
        onClick={() => {
          setBusy(true);
          void signIn('orcid', { callbackUrl });
        }}
      >
        {busy ? 'Going to ORCID…' : 'Sign in with ORCID'}
      </Button>
    </section>
  );
}
