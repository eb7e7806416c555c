import type { FormEvent, MouseEvent } from 'react';
import type { FieldErrors } from '@/lib/errors';
import { formatCount } from '@/lib/format/plural';
import { BOUND_TOLERANCE } from '@/lib/search/ranges';
import type { FacetBucket, FacetName } from '@/lib/search/types';
import { facetLabel } from './facet-labels';
import {
  filterCount, includesAllVersions, isFacetSelected, isOverlapMode, URL_FACETS, type RangeKey, type RangeValues, type SearchUrlState,
} from './search-url';

const FACET_TITLES: Record<FacetName, string> = {
  material: 'Material', quantity: 'Quantity', method: 'Method', excitation: 'Excitation', group: 'Lab', year: 'Year published',
};
const INPUT = 'w-full rounded-md border bg-white px-2 py-1 text-sm tabular-nums';

export type SearchFiltersProps = {
  /** The search as the URL has it: ticked facets and switches, and the text and order the plain form sends along. */
  state: SearchUrlState;
  /** The range fields as typed (they reach the URL a moment after typing stops). */
  ranges: RangeValues;
  facets: Record<FacetName, FacetBucket[]>;
  /** Field errors of the last answer (a swapped range), shown at the field. */
  fieldErrors?: FieldErrors;
  clearHref: string;
  onFacet: (name: FacetName, value: string, on: boolean) => void;
  onRange: (key: RangeKey, text: string) => void;
  onRangeBlur: () => void;
  onRangeMode: (overlaps: boolean) => void;
  onAllVersions: (all: boolean) => void;
  onSubmit: (event: FormEvent<HTMLFormElement>) => void;
  onClear: (event: MouseEvent<HTMLAnchorElement>) => void;
};

function Facet({ name, buckets, state, onFacet }: { name: FacetName; buckets: FacetBucket[]; state: SearchUrlState; onFacet: SearchFiltersProps['onFacet'] }) {
  if (buckets.length === 0) return null;
  // Years read best as a calendar, newest first; the other facets come most frequent first, as the API lists them.
  const shown = name === 'year' ? [...buckets].sort((a, b) => b.value.localeCompare(a.value)) : buckets;
  return (
    // min-w-0: a fieldset is at least as wide as its content by default, so a long lab name would push past the column.
    <fieldset className="flex min-w-0 flex-col gap-1">
      <legend className="mb-1 text-sm font-semibold text-slate-900">{FACET_TITLES[name]}</legend>
      {shown.map((b) => (
        <label key={b.value} className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" name={name} value={b.value} checked={isFacetSelected(state, name, b.value)}
            onChange={(e) => onFacet(name, b.value, e.target.checked)} className="h-4 w-4 shrink-0 accent-copper-700" />
          <span className="min-w-0 flex-1 truncate" title={facetLabel(name, b)}>{facetLabel(name, b)}</span>
          <span className="shrink-0 tabular-nums text-slate-500">{formatCount(b.count)}</span>
        </label>
      ))}
    </fieldset>
  );
}

function NumberField({ name, label, value, hint, error, onChange, onBlur }: {
  name: RangeKey; label: string; value: string; hint?: string; error?: string; onChange: (text: string) => void; onBlur: () => void;
}) {
  const described = [hint ? `${name}-hint` : '', error ? `${name}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <label className="flex flex-col gap-0.5 text-xs font-medium text-slate-700">
      {label}
      <input type="number" name={name} step="any" min={0} value={value} onChange={(e) => onChange(e.target.value)} onBlur={onBlur}
        aria-invalid={error ? true : undefined} aria-describedby={described}
        className={`${INPUT} ${error ? 'border-red-600' : 'border-slate-300'}`} />
      {hint && <span id={`${name}-hint`} className="font-normal text-slate-500">{hint}</span>}
      {error && <span id={`${name}-error`} className="font-normal text-red-800">{error}</span>}
    </label>
  );
}

/**
 * Facets with counts and range filters. In the browser every change applies at once (the page updates its URL and
 * results); without JavaScript it is a plain GET form, so the URL still holds the whole search and can be shared.
 */
export function SearchFilters({ state, ranges, facets, fieldErrors = {}, clearHref, ...on }: SearchFiltersProps) {
  const range = (name: RangeKey, label: string, hint?: string) => (
    <NumberField name={name} label={label} value={ranges[name]} hint={hint} error={fieldErrors[name]}
      onChange={(text) => on.onRange(name, text)} onBlur={on.onRangeBlur} />
  );
  const count = filterCount(state);
  return (
    <details className="group rounded-lg border border-slate-200 bg-white lg:border-0 lg:bg-transparent lg:details-content:[content-visibility:visible]">
      <summary className="flex cursor-pointer items-center justify-between gap-2 px-4 py-2.5 text-sm font-semibold text-slate-900 lg:hidden">
        <span>Filters{count > 0 && <span className="font-normal text-slate-600"> · {count} set</span>}</span>
        <svg aria-hidden="true" viewBox="0 0 16 16" className="h-4 w-4 fill-current text-slate-500 transition-transform group-open:rotate-180"><path d="M3.5 6 8 10.5 12.5 6z" /></svg>
      </summary>
      <form action="/search" method="get" className="flex flex-col gap-5 px-4 pb-4 pt-2 lg:p-0" aria-label="Filters" onSubmit={on.onSubmit}>
        {state.q && <input type="hidden" name="q" value={state.q} />}
        {state.sort && <input type="hidden" name="sort" value={state.sort} />}
        {state.rest.map(([k, v], i) => <input key={`${k}-${i}`} type="hidden" name={k} value={v} />)}
        {URL_FACETS.map((name) => <Facet key={name} name={name} buckets={facets[name] ?? []} state={state} onFacet={on.onFacet} />)}
        <fieldset className="flex min-w-0 flex-col gap-2">
          <legend className="mb-1 text-sm font-semibold text-slate-900">Ranges the curves cover</legend>
          <div className="grid grid-cols-2 gap-2">
            {range('tMin', 'T from (K)')}
            {range('tMax', 'T to (K)')}
          </div>
          {range('bMax', 'Field up to (T)', '1 T = 10 kOe (lab convention)')}
          <div className="grid grid-cols-2 gap-2">
            {range('fMin', 'f from (Hz)')}
            {range('fMax', 'f to (Hz)')}
          </div>
          <label className="flex items-center gap-2 text-sm text-slate-800">
            <input type="checkbox" name="rangeMode" value="overlaps" checked={isOverlapMode(state)} onChange={(e) => on.onRangeMode(e.target.checked)}
              className="h-4 w-4 accent-copper-700" />
            Partial overlap is enough
          </label>
          <p className="text-xs text-slate-500">Bounds match within {BOUND_TOLERANCE * 100} %: a sweep logged as 2.0015–299.9998 K counts as 2–300 K.</p>
        </fieldset>
        <label className="flex items-center gap-2 text-sm text-slate-800">
          <input type="checkbox" name="allVersions" value="true" checked={includesAllVersions(state)} onChange={(e) => on.onAllVersions(e.target.checked)}
            className="h-4 w-4 accent-copper-700" />
          Include earlier versions
        </label>
        <div className="flex gap-2">
          <button type="submit" className="rounded-md bg-copper-700 px-3 py-1.5 text-sm font-semibold text-white hover:bg-copper-800">Apply filters</button>
          <a href={clearHref} onClick={on.onClear} className="rounded-md px-3 py-1.5 text-sm text-copper-800 underline">Clear</a>
        </div>
      </form>
    </details>
  );
}
