import type { FacetBucket, FacetName, SearchQuery } from '@/lib/search/types';

const FACET_TITLES: Record<FacetName, string> = {
  material: 'Material', quantity: 'Quantity', method: 'Method', excitation: 'Excitation', group: 'Lab', year: 'Year published',
};
const INPUT = 'w-full rounded-md border border-slate-300 bg-white px-2 py-1 text-sm tabular-nums';

function Facet({ name, buckets, selected }: { name: FacetName; buckets: FacetBucket[]; selected: readonly string[] }) {
  if (buckets.length === 0) return null;
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="mb-1 text-sm font-semibold text-slate-900">{FACET_TITLES[name]}</legend>
      {buckets.map((b) => (
        <label key={b.value} className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" name={name} value={b.value} defaultChecked={selected.includes(b.value)} className="h-4 w-4 accent-copper-700" />
          <span className="min-w-0 flex-1 truncate">{b.label ?? b.value}</span>
          <span className="tabular-nums text-slate-500">{b.count}</span>
        </label>
      ))}
    </fieldset>
  );
}

function NumberField({ name, label, value, hint }: { name: string; label: string; value?: number; hint?: string }) {
  return (
    <label className="flex flex-col gap-0.5 text-xs font-medium text-slate-700">
      {label}
      <input type="number" name={name} step="any" min={0} defaultValue={value} className={INPUT} aria-describedby={hint ? `${name}-hint` : undefined} />
      {hint && <span id={`${name}-hint`} className="font-normal text-slate-500">{hint}</span>}
    </label>
  );
}

/** Facets with counts and range filters as one GET form: the URL holds the whole search, so it can be shared. */
export function SearchFilters({ query, facets }: { query: SearchQuery; facets: Record<FacetName, FacetBucket[]> }) {
  return (
    <form action="/search" method="get" className="flex flex-col gap-5" aria-label="Filters">
      {query.q && <input type="hidden" name="q" value={query.q} />}
      {query.sort && <input type="hidden" name="sort" value={query.sort} />}
      {(Object.keys(FACET_TITLES) as FacetName[]).map((name) => (
        <Facet key={name} name={name} buckets={facets[name] ?? []} selected={(query[name] as string[] | undefined) ?? []} />
      ))}
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-slate-900">Ranges the curves cover</legend>
        <div className="grid grid-cols-2 gap-2">
          <NumberField name="tMin" label="T from (K)" value={query.tMin} />
          <NumberField name="tMax" label="T to (K)" value={query.tMax} />
        </div>
        <NumberField name="bMax" label="Field up to (T)" value={query.bMax} hint="1 T = 10 kOe (lab convention)" />
        <div className="grid grid-cols-2 gap-2">
          <NumberField name="fMin" label="f from (Hz)" value={query.fMin} />
          <NumberField name="fMax" label="f to (Hz)" value={query.fMax} />
        </div>
        <label className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" name="rangeMode" value="overlaps" defaultChecked={query.rangeMode === 'overlaps'} className="h-4 w-4 accent-copper-700" />
          Partial overlap is enough
        </label>
      </fieldset>
      <label className="flex items-center gap-2 text-sm text-slate-800">
        <input type="checkbox" name="allVersions" value="true" defaultChecked={query.allVersions === true} className="h-4 w-4 accent-copper-700" />
        Include earlier versions
      </label>
      <div className="flex gap-2">
        <button type="submit" className="rounded-md bg-copper-700 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-800">Apply filters</button>
        <a href={query.q ? `/search?q=${encodeURIComponent(query.q)}` : '/search'} className="rounded-md px-3 py-1.5 text-sm text-copper-800 underline">Clear</a>
      </div>
    </form>
  );
}
