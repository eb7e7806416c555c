'use client';

import Link from 'next/link';

export default function AuthoringError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center" role="alert">
      <h1 className="text-2xl font-semibold">This page could not be shown</h1>
      <p className="mt-2 text-slate-600">
        What you saved is safe, and changes not yet saved are kept in this browser. Try again; if it keeps failing, give the
        site admin this reference: <span className="font-mono">{error.digest ?? 'none'}</span>.
      </p>
      <div className="mt-6 flex justify-center gap-3">
        <button type="button" onClick={reset} className="rounded-md bg-copper-600 px-4 py-2 font-semibold text-white hover:bg-copper-700">Try again</button>
        <Link href="/deposit" className="rounded-md border border-slate-300 bg-white px-4 py-2 font-semibold text-slate-800 hover:bg-slate-100">Your drafts</Link>
      </div>
    </div>
  );
}
