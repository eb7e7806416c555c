export default function AuthoringLoading() {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-4">
      <span className="sr-only">Loading…</span>
      <div className="h-8 w-2/3 animate-pulse rounded bg-slate-200" />
      <div className="h-4 w-1/2 animate-pulse rounded bg-slate-200" />
      <div className="mt-4 h-40 animate-pulse rounded-lg bg-slate-200" />
      <div className="h-64 animate-pulse rounded-lg bg-slate-200" />
    </div>
  );
}
