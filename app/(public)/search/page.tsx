import type { Metadata } from 'next';
import { type SearchAnswer, problemAnswer } from '@/components/search/search-answer';
import { searchKey, stateFromParams } from '@/components/search/search-url';
import { SearchView } from '@/components/search/search-view';
import { PageTitle } from '@/components/ui/page-title';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { searchPublished } from '@/lib/search/search-service';
import { SearchQueryError } from '@/lib/search/types';

export const metadata: Metadata = { title: 'Search' };
export const dynamic = 'force-dynamic';

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

function toParams(raw: Record<string, string | string[] | undefined>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(raw)) for (const value of Array.isArray(v) ? v : v === undefined ? [] : [v]) params.append(k, value);
  return params;
}

/**
 * Search over published datasets of every lab. The URL is the whole search: this server render answers it (a shared
 * address opens with its results in the HTML, and the forms work as plain GETs without JavaScript); in the browser
 * SearchView takes over, keeps the URL in step and asks /api/v1/search with the same canonical query.
 */
export default async function SearchPage({ searchParams }: { searchParams: SearchParams }) {
  // The canonical query, as the browser will send it to the API: both read the same search out of any spelling of the URL.
  const key = searchKey(stateFromParams(toParams(await searchParams)));
  let answer: SearchAnswer;
  try {
    answer = { kind: 'result', result: await searchPublished(parseSearchQuery(new URLSearchParams(key))) };
  } catch (error) {
    if (!(error instanceof SearchQueryError)) throw error;
    answer = problemAnswer(error.message, error.details?.fieldErrors);
  }
  return (
    <div className="flex flex-col gap-6">
      <PageTitle lead="Published transport datasets of every lab: find curves by material, quantity, method and the ranges they cover.">Search</PageTitle>
      <SearchView initial={{ key, answer }} />
    </div>
  );
}
