import type { Metadata } from 'next';
import Link from 'next/link';
import { SearchFilters } from '@/components/search/search-filters';
import { SearchHitCard } from '@/components/search/search-hit-card';
import { PageTitle } from '@/components/ui/page-title';
import { plural } from '@/lib/format/plural';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { searchPublished } from '@/lib/search/search-service';
import { SearchQueryError, type SearchQuery, type SearchResult } from '@/lib/search/types';

export const metadata: Metadata = { title: 'Search' };
export const dynamic = 'force-dynamic';

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

function toParams(raw: Record<string, string | string[] | undefined>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(raw)) for (const value of Array.isArray(v) ? v : v === undefined ? [] : [v]) params.append(k, value);
  return params;
}

function pageHref(params: URLSearchParams, page: number): string {
  const next = new URLSearchParams(params);
  next.set('page', String(page));
  return `/search?${next.toString()}`;
}

/** Search over published datasets of every lab: text, facets with counts, ranges; the URL is the whole state. */
export default async function SearchPage({ searchParams }: { searchParams: SearchParams }) {
  const params = toParams(await searchParams);
  let query: SearchQuery = {};
  let result: SearchResult | null = null;
  let problem: string | null = null;
  try {
    query = parseSearchQuery(params);
    result = await searchPublished(query);
  } catch (error) {
    if (!(error instanceof SearchQueryError)) throw error;
    problem = [error.message, ...Object.values(error.details?.fieldErrors ?? {})].join(' ');
  }
  const sortParams = new URLSearchParams(params);
  sortParams.delete('page');
  const lastPage = result ? Math.max(1, Math.ceil(result.total / result.pageSize)) : 1;
  return (
    <div className="flex flex-col gap-6">
      <PageTitle lead="Published transport datasets of every lab: find curves by material, quantity, method and the ranges they cover.">Search</PageTitle>
      <form action="/search" method="get" role="search" className="flex flex-wrap gap-2">
        <label htmlFor="search-q" className="sr-only">Search text</label>
        <input id="search-q" name="q" type="search" defaultValue={query.q ?? ''} placeholder="e.g. niobium, Bi2Se3, sheet resistance, Hall bar"
          className="min-w-0 flex-1 rounded-md border border-slate-300 bg-white px-3 py-2" />
        <label htmlFor="search-sort" className="sr-only">Order</label>
        <select id="search-sort" name="sort" defaultValue={query.sort ?? (query.q ? 'relevance' : 'date')} className="rounded-md border border-slate-300 bg-white px-2 py-2 text-sm">
          <option value="relevance">Best match first</option>
          <option value="date">Newest first</option>
        </select>
        <button type="submit" className="rounded-md bg-copper-700 px-4 py-2 font-semibold text-white hover:bg-copper-800">Search</button>
      </form>
      {problem && <p role="alert" className="rounded-md border border-red-300 bg-red-50 p-4 text-sm text-red-900">{problem} <Link href="/search" className="underline">Start a new search</Link>.</p>}
      {result && (
        <div className="grid gap-8 lg:grid-cols-[16rem_minmax(0,1fr)]">
          <aside><SearchFilters query={query} facets={result.facets} /></aside>
          <section aria-labelledby="results-heading" className="flex min-w-0 flex-col gap-3">
            <h2 id="results-heading" className="text-sm text-slate-700" aria-live="polite">
              {plural(result.total, 'published version')}{result.total > 0 && ` · page ${result.page} of ${lastPage}`}
            </h2>
            {result.notes.map((n) => <p key={n} className="text-xs text-slate-600">{n}</p>)}
            {result.hits.length === 0 ? (
              <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-slate-700">
                Nothing matches. Try fewer words, remove a filter, or tick “Partial overlap is enough” for the ranges.
              </p>
            ) : (
              <ul className="flex flex-col gap-3">{result.hits.map((h) => <li key={h.doc.versionId}><SearchHitCard hit={h} /></li>)}</ul>
            )}
            {lastPage > 1 && (
              <nav aria-label="Pages" className="flex gap-3 text-sm">
                {result.page > 1 && <Link href={pageHref(sortParams, result.page - 1)} className="text-copper-800 underline">Previous</Link>}
                {result.page < lastPage && <Link href={pageHref(sortParams, result.page + 1)} className="text-copper-800 underline">Next</Link>}
              </nav>
            )}
          </section>
        </div>
      )}
    </div>
  );
}
