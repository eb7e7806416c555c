'use client';

import { useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useRef, useState, useSyncExternalStore, type FormEvent, type MouseEvent } from 'react';
import { formatCount, plural } from '@/lib/format/plural';
import type { FacetBucket, FacetName, SearchResult } from '@/lib/search/types';
import { fetchSearchAnswer, knownAnswer, rememberAnswer, subscribeAnswers, type SearchAnswer } from './search-answer';
import { SearchFilters } from './search-filters';
import { SearchHitCard } from './search-hit-card';
import {
  effectiveSort, sameRanges, searchHref, searchKey, stateFromParams, withAllVersions, withFacet, withoutFilters, withPage,
  withRangeMode, withRanges, withSort, withText, type RangeKey, type RangeValues, type SearchUrlState,
} from './search-url';

export type SearchViewProps = {
  /** The server's answer for the URL the page was rendered for, under that URL's search key. */
  initial: { key: string; answer: SearchAnswer };
};

// Quiet time after the last keystroke before the URL and the results follow the text and the range fields.
const TEXT_DEBOUNCE_MS = 350;
const RANGE_DEBOUNCE_MS = 600;

const NO_FACETS: Record<FacetName, FacetBucket[]> = { material: [], quantity: [], method: [], excitation: [], group: [], year: [] };

/** A click the browser would handle as "open here" (not a new tab or window), which the page may take over. */
function isPlainClick(event: MouseEvent<HTMLAnchorElement>): boolean {
  return event.button === 0 && !event.metaKey && !event.ctrlKey && !event.shiftKey && !event.altKey && !event.defaultPrevented;
}

/**
 * The answer for `key`: the server's first one, one fetched earlier in this page's life, or a fetch of
 * /api/v1/search (the previous one aborted when the key changes again). Until it arrives the last results stay.
 */
function useSearchAnswer(key: string, initial: SearchViewProps['initial']) {
  const remembered = useSyncExternalStore(subscribeAnswers, () => knownAnswer(key), () => undefined);
  const answer = key === initial.key ? initial.answer : remembered;
  const [failure, setFailure] = useState<{ key: string; message: string } | null>(null);
  const [attempt, setAttempt] = useState(0);

  useEffect(() => {
    // Keep the server's answer too, so coming back to this search after the page re-mounts needs no fetch.
    if (!knownAnswer(initial.key)) rememberAnswer(initial.key, initial.answer);
  }, [initial]);

  useEffect(() => {
    if (answer) return;
    const controller = new AbortController();
    fetchSearchAnswer(key, controller.signal).then(
      (fetched) => rememberAnswer(key, fetched),
      (error: unknown) => {
        if (controller.signal.aborted) return;
        setFailure({ key, message: error instanceof Error ? error.message : 'The search could not be run.' });
      },
    );
    return () => controller.abort();
  }, [key, answer, attempt]);

  // The results on screen: this search's, or the last ones shown while the next arrive (never a blank page).
  const [lastResult, setLastResult] = useState<SearchResult | null>(initial.answer.kind === 'result' ? initial.answer.result : null);
  if (answer?.kind === 'result' && answer.result !== lastResult) setLastResult(answer.result);

  const failed = !answer && failure?.key === key ? failure.message : null;
  return {
    answer,
    result: answer?.kind === 'result' ? answer.result : lastResult,
    busy: !answer && !failed,
    failed,
    retry: () => {
      setFailure(null);
      setAttempt((n) => n + 1);
    },
  };
}

/**
 * The search page in the browser: the URL is the search (shareable, Back and Forward restore it), the results come
 * from /api/v1/search. Deliberate changes (a tick, the order, a page, Enter) add a history entry; typing adds one for
 * the first pause and then replaces it, so Back returns to the search before the typing began.
 */
export function SearchView({ initial }: SearchViewProps) {
  const params = useSearchParams();
  const urlState = useMemo(() => stateFromParams(new URLSearchParams(params.toString())), [params]);
  const urlKey = searchKey(urlState);

  // Searches this page has written to the history that the router has not shown yet (it updates the URL state in a
  // transition): until it does, the controls and the results follow the newest of them, so a tick sticks at once.
  const [pending, setPending] = useState<{ key: string; state: SearchUrlState }[]>([]);
  // What the text and range fields show; they follow the URL when it changes by Back, Forward or a link.
  const [draftText, setDraftText] = useState(urlState.q);
  const [draftRanges, setDraftRanges] = useState<RangeValues>(urlState.ranges);
  const [seenUrlKey, setSeenUrlKey] = useState(urlKey);
  if (seenUrlKey !== urlKey) {
    setSeenUrlKey(urlKey);
    const landed = pending.findIndex((p) => p.key === urlKey);
    if (landed >= 0) {
      setPending(pending.slice(landed + 1));
    } else {
      setPending([]);
      setDraftText(urlState.q);
      setDraftRanges(urlState.ranges);
    }
  }
  const newest = pending.at(-1);
  const state = newest?.state ?? urlState;
  const key = newest?.key ?? urlKey;
  const { answer, result, busy, failed, retry } = useSearchAnswer(key, initial);

  const latest = useRef({ state, draftText, draftRanges });
  useEffect(() => {
    latest.current = { state, draftText, draftRanges };
  });
  const timer = useRef<number | undefined>(undefined);
  // True once a pause in typing has put a history entry down; later pauses of the same typing replace that entry.
  const typing = useRef(false);
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => () => window.clearTimeout(timer.current), []);

  /** The URL's search with what the fields hold now (a pending keystroke is not lost to a tick made meanwhile). */
  const current = (): SearchUrlState => {
    const { state: now, draftText: text, draftRanges: ranges } = latest.current;
    const withTyped = text.trim() === now.q.trim() ? now : withText(now, text);
    return sameRanges(ranges, now.ranges) ? withTyped : withRanges(withTyped, ranges);
  };

  const go = (next: SearchUrlState, mode: 'push' | 'replace') => {
    window.clearTimeout(timer.current);
    const nextKey = searchKey(next);
    // The fields take the new search's values only where they differ in meaning (a trailing space being typed stays).
    const { draftText: text, draftRanges: ranges } = latest.current;
    if (next.q.trim() !== text.trim()) setDraftText(next.q);
    if (!sameRanges(next.ranges, ranges)) setDraftRanges(next.ranges);
    if (nextKey === searchKey(latest.current.state)) return;
    setPending((list) => [...list, { key: nextKey, state: next }]);
    latest.current = { ...latest.current, state: next };
    // Next.js follows the History API: useSearchParams sees the new URL, and no server render is requested.
    if (mode === 'push') window.history.pushState(null, '', searchHref(next));
    else window.history.replaceState(null, '', searchHref(next));
  };
  /** A tick, the order, a page, Clear: a history entry of its own. */
  const deliberate = (next: SearchUrlState) => {
    typing.current = false;
    go(next, 'push');
  };
  /** A pause in typing, or Enter: the first puts a history entry down, the rest of the same typing replace it. */
  const typed = () => {
    go(current(), typing.current ? 'replace' : 'push');
    typing.current = true;
  };
  const typedLater = (ms: number) => {
    window.clearTimeout(timer.current);
    timer.current = window.setTimeout(typed, ms);
  };

  const onText = (text: string) => {
    setDraftText(text);
    latest.current = { ...latest.current, draftText: text };
    typedLater(TEXT_DEBOUNCE_MS);
  };
  const onRange = (name: RangeKey, text: string) => {
    const ranges = { ...latest.current.draftRanges, [name]: text };
    setDraftRanges(ranges);
    latest.current = { ...latest.current, draftRanges: ranges };
    typedLater(RANGE_DEBOUNCE_MS);
  };
  // Leaving a field ends its typing: the next change, typed or not, gets its own history entry.
  const endTyping = () => {
    typing.current = false;
  };
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    typed();
    typing.current = false;
  };
  const onPage = (event: MouseEvent<HTMLAnchorElement>, page: number) => {
    if (!isPlainClick(event)) return;
    event.preventDefault();
    deliberate(withPage(state, page));
    // The link may vanish (last page): focus goes to the results heading, whose count the new page replaces.
    headingRef.current?.focus();
  };
  const onClear = (event: MouseEvent<HTMLAnchorElement>) => {
    if (!isPlainClick(event)) return;
    event.preventDefault();
    deliberate(withoutFilters(current()));
  };

  const problem = answer?.kind === 'problem' ? answer : null;
  const lastPage = result ? Math.max(1, Math.ceil(result.total / result.pageSize)) : 1;
  const pageHref = (page: number) => searchHref(withPage(state, page));

  return (
    <div className="flex flex-col gap-6">
      <form action="/search" method="get" role="search" className="flex flex-wrap gap-2" onSubmit={onSubmit}>
        <label htmlFor="search-q" className="sr-only">Search text</label>
        <input id="search-q" name="q" type="search" value={draftText} onChange={(e) => onText(e.target.value)} onBlur={endTyping}
          placeholder="e.g. niobium, Bi2Se3, sheet resistance, Hall bar" autoComplete="off"
          className="w-full min-w-0 rounded-md border border-slate-300 bg-white px-3 py-2 sm:w-auto sm:flex-1" />
        <label htmlFor="search-sort" className="sr-only">Order</label>
        <select id="search-sort" name="sort" value={answer?.kind === 'result' ? answer.result.sort : effectiveSort(state)} onChange={(e) => deliberate(withSort(current(), e.target.value === 'date' ? 'date' : 'relevance'))}
          className="flex-1 rounded-md border border-slate-300 bg-white px-2 py-2 text-sm sm:flex-none">
          <option value="relevance" disabled={!state.q.trim()}>Best match first</option>
          <option value="date">Newest first</option>
        </select>
        {/* Hidden fields carry the filters when the form is sent without JavaScript. */}
        {hiddenFilterFields(state)}
        <button type="submit" className="rounded-md bg-copper-700 px-4 py-2 font-semibold text-white hover:bg-copper-800">Search</button>
      </form>

      {problem && (
        <p role="alert" className="rounded-md border border-red-300 bg-red-50 p-4 text-sm text-red-900">
          {problem.message}{' '}
          {result ? 'The results below are from the search before.' : <a href="/search" className="underline">Start a new search.</a>}
        </p>
      )}
      {failed && (
        <div role="alert" className="flex flex-wrap items-center gap-x-3 gap-y-2 rounded-md border border-red-300 bg-red-50 p-4 text-sm text-red-900">
          <p>The results could not be updated: {failed}{result && ' The results below are from the search before.'}</p>
          <button type="button" onClick={retry} className="rounded-md border border-red-400 bg-white px-3 py-1 font-semibold text-red-900 hover:bg-red-100">Try again</button>
        </div>
      )}

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[16rem_minmax(0,1fr)] lg:gap-8">
        <aside className="min-w-0">
          <SearchFilters state={state} ranges={draftRanges} facets={result?.facets ?? NO_FACETS} fieldErrors={problem?.fieldErrors}
            clearHref={searchHref(withoutFilters(state))} onFacet={(name, value, on) => deliberate(withFacet(current(), name, value, on))}
            onRange={onRange} onRangeBlur={endTyping} onRangeMode={(on) => deliberate(withRangeMode(current(), on))}
            onAllVersions={(on) => deliberate(withAllVersions(current(), on))} onSubmit={onSubmit} onClear={onClear} />
        </aside>
        {result && (
          <section aria-labelledby="results-heading" aria-busy={busy} className="flex min-w-0 flex-col gap-3">
            <div className="flex flex-wrap items-baseline justify-between gap-x-3">
              <h2 id="results-heading" ref={headingRef} tabIndex={-1} className="text-sm text-slate-700 focus:outline-none focus-visible:outline" aria-live="polite">
                {plural(result.total, 'published version')}{result.total > 0 && ` · page ${formatCount(result.page)} of ${formatCount(lastPage)}`}
              </h2>
              <p className={`flex items-center gap-1.5 text-xs text-slate-600 ${busy ? 'visible' : 'invisible'}`}>
                <svg aria-hidden="true" viewBox="0 0 16 16" className="h-3.5 w-3.5 animate-spin text-copper-700 motion-reduce:animate-none">
                  <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeOpacity="0.25" strokeWidth="2" />
                  <path d="M8 2a6 6 0 0 1 6 6" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
                </svg>
                Updating results…
              </p>
            </div>
            <div className={`flex flex-col gap-3 transition-opacity ${busy ? 'opacity-60' : ''}`}>
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
                  {result.page > 1 && <a href={pageHref(result.page - 1)} onClick={(e) => onPage(e, result.page - 1)} className="text-copper-800 underline">Previous</a>}
                  {result.page < lastPage && <a href={pageHref(result.page + 1)} onClick={(e) => onPage(e, result.page + 1)} className="text-copper-800 underline">Next</a>}
                </nav>
              )}
            </div>
          </section>
        )}
      </div>
    </div>
  );
}

/** The URL's filters as hidden fields of the text form, so a plain GET keeps them (page and order excepted). */
function hiddenFilterFields(state: SearchUrlState) {
  const params = new URLSearchParams(searchKey({ ...state, q: '', sort: '', page: '' }));
  return [...params].map(([k, v], i) => <input key={`${k}-${i}`} type="hidden" name={k} value={v} />);
}
