'use client';

import Link from 'next/link';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';

export type SignInFormProps = { callbackUrl: string; initialError?: string };

const ERRORS: Record<string, string> = {
  CredentialsSignin: 'E-mail or password is wrong. Check both, or use a sign-in link.',
  EmailSignin: 'We could not send the sign-in link. Try again in a minute.',
  Verification: 'That sign-in link has expired or was already used. Ask for a new one.',
  OAuthSignin: 'Signing in with ORCID did not start. Try again in a minute.',
  OAuthCallback: 'Signing in with ORCID did not finish. Try again in a minute.',
  orcid_email_unconfirmed: 'An Ohmstead account uses the e-mail address on your ORCID record but has not confirmed it. Sign in to it with a link by e-mail first, then sign in with ORCID to link the two.',
  orcid_orcid_conflict: 'The Ohmstead account with the e-mail address on your ORCID record is linked to a different ORCID iD.',
  orcid_account_disabled: 'This Ohmstead account is disabled. Ask the site admin.',
  orcid_invalid_orcid: 'The identity provider did not send a valid ORCID iD.',
};

export function SignInForm({ callbackUrl, initialError }: SignInFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | undefined>(initialError ? (ERRORS[initialError] ?? 'Sign-in failed. Try again.') : undefined);
  const [busy, setBusy] = useState(false);

  async function onPassword(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(undefined);
    const result = await signIn('credentials', { email: form.get('email'), password: form.get('password'), redirect: false });
    setBusy(false);
    if (result?.ok && !result.error) {
      router.push(callbackUrl);
      router.refresh();
    } else {
      setError(result?.error && result.error !== 'CredentialsSignin' ? result.error : ERRORS.CredentialsSignin);
    }
  }

  async function onLink(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    await signIn('email', { email: form.get('link-email'), callbackUrl });
  }

  return (
    <div className="grid gap-8 md:grid-cols-2">
      <form onSubmit={onPassword} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" aria-labelledby="pw-heading" noValidate>
        <h2 id="pw-heading" className="font-semibold">With your password</h2>
        {error && <Notice tone="error">{error}</Notice>}
        <TextField label="E-mail address" name="email" type="email" autoComplete="email" required />
        <TextField label="Password" name="password" type="password" autoComplete="current-password" required />
        <Button type="submit" disabled={busy}>{busy ? 'Signing in…' : 'Sign in'}</Button>
        <Link href="/reset-password" className="text-sm text-copper-700 underline">Forgot your password?</Link>
      </form>
      <form onSubmit={onLink} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" aria-labelledby="link-heading">
        <h2 id="link-heading" className="font-semibold">With a link by e-mail</h2>
        <p className="text-sm text-slate-600">We send a one-time link that signs you in. It expires after 15 minutes.</p>
        <TextField label="E-mail address" name="link-email" id="link-email" type="email" autoComplete="email" required />
        <Button type="submit" variant="secondary" disabled={busy}>Send me a sign-in link</Button>
      </form>
    </div>
  );
}
