/** Shown while the compare page loads: controls, plot and legend as empty shapes. */
export default function LoadingCompare() {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-5">
      <span className="sr-only">Loading the curves to compare…</span>
      <div aria-hidden="true" className="flex animate-pulse flex-col gap-4">
        <div className="h-8 w-56 rounded bg-slate-200" />
        <div className="h-24 rounded bg-slate-200" />
        <div className="h-80 rounded bg-slate-200" />
        <div className="h-32 rounded bg-slate-200" />
      </div>
    </div>
  );
}
