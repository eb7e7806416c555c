'use client';

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center" role="alert">
      <h1 className="text-2xl font-semibold">Something went wrong</h1>
      <p className="mt-2 text-slate-600">The page could not be shown. Nothing you saved is lost. Try again; if it keeps failing, give the site admin this reference: <span className="font-mono">{error.digest ?? 'none'}</span>.</p>
      <button type="button" onClick={reset} className="mt-6 rounded-md bg-copper-600 px-4 py-2 font-semibold text-white">Try again</button>
    </div>
  );
}
