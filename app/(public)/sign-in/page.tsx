import type { Metadata } from 'next';
import Link from 'next/link';
import { OrcidSignInButton } from '@/components/auth/orcid-sign-in-button';
import { SignInForm } from '@/components/auth/sign-in-form';
import { PageTitle } from '@/components/ui/page-title';
import { orcidConfigured } from '@/lib/auth/orcid-provider';

export const metadata: Metadata = { title: 'Sign in' };

function safeCallback(url: string | undefined): string {
  // Only same-site paths; never an open redirect.
  return url && url.startsWith('/') && !url.startsWith('//') ? url : '/groups';
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string }> }) {
  const { callbackUrl, error } = await searchParams;
  return (
    <div className="mx-auto max-w-4xl">
      <PageTitle lead={<>New to Ohmstead? <Link href="/sign-up" className="text-copper-700 underline">Create an account</Link>.</>}>Sign in</PageTitle>
      <SignInForm callbackUrl={safeCallback(callbackUrl)} initialError={error} />
      {orcidConfigured() && <OrcidSignInButton callbackUrl={safeCallback(callbackUrl)} />}
    </div>
  );
}
