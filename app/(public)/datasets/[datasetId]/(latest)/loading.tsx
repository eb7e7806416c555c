/** Shown while the dataset page loads: the shape of header, citation and sections, without content. */
export default function LoadingDataset() {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-6">
      <span className="sr-only">Loading the dataset…</span>
      <div aria-hidden="true" className="flex animate-pulse flex-col gap-3 border-b border-slate-200 pb-6">
        <div className="h-4 w-48 rounded bg-slate-200" />
        <div className="h-8 w-full max-w-2xl rounded bg-slate-200" />
        <div className="h-4 w-80 max-w-full rounded bg-slate-200" />
        <div className="h-6 w-64 max-w-full rounded bg-slate-200" />
      </div>
      <div aria-hidden="true" className="grid animate-pulse gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="h-40 rounded-lg bg-slate-200 lg:order-2" />
        <div className="flex flex-col gap-4 lg:order-1">
          <div className="h-5 w-32 rounded bg-slate-200" />
          <div className="h-24 rounded bg-slate-200" />
          <div className="h-64 rounded bg-slate-200" />
        </div>
      </div>
    </div>
  );
}
