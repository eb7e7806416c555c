/** While the review copy loads (the curves and derived tables can take a moment). */
export default function ReviewLoading() {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-4">
      <p className="text-sm text-slate-700">Loading the review copy…</p>
      <div className="h-8 w-2/3 animate-pulse rounded bg-slate-200" />
      <div className="h-64 animate-pulse rounded bg-slate-100" />
    </div>
  );
}
