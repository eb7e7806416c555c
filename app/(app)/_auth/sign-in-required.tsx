'use client';

import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useEffect } from 'react';

/** Shown by the authoring layout to visitors who are not signed in: sends them to sign-in and back here after. */
export function SignInRequired() {
  const router = useRouter();
  const path = usePathname();
  const query = useSearchParams().toString();
  const target = `/sign-in?callbackUrl=${encodeURIComponent(query ? `${path}?${query}` : path)}`;
  useEffect(() => {
    router.replace(target);
  }, [router, target]);
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">Sign in to continue</h1>
      <p className="mt-2 text-slate-600">Depositing and drafts are for signed-in members of a group. Taking you to the sign-in page…</p>
      <Link href={target} className="mt-6 inline-block rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700">Sign in</Link>
    </div>
  );
}
