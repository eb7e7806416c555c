// The search page's state as its URL holds it, and back. Pure (no React, no Next): the server page reads the first
// search with it, the browser writes the URL and asks /api/v1/search with the same canonical query string, which is
// also the key under which answers are kept for Back and Forward.
import { FORMULA_ALIASES, formulaKey } from '@/lib/search/normalise-formula';
import { FACET_NAMES, type FacetName } from '@/lib/search/types';

// The facets in the order of the URL and the filter panel.
export const URL_FACETS: readonly FacetName[] = FACET_NAMES;
export const RANGE_KEYS = ['tMin', 'tMax', 'bMax', 'fMin', 'fMax'] as const;
export type RangeKey = (typeof RANGE_KEYS)[number];
export type RangeValues = Record<RangeKey, string>;

/**
 * Everything a search URL says. Values stay the strings the URL holds (trimmed), so a malformed one (tMin=abc) reaches
 * the API unchanged and is reported there in plain words; '' means "not given".
 */
export type SearchUrlState = {
  q: string;
  facets: Record<FacetName, string[]>;
  ranges: RangeValues;
  /** 'overlaps' (partial overlap is enough) or '' for the default, the curve covers the range. */
  rangeMode: string;
  /** 'true' to include superseded versions. */
  allVersions: string;
  /** 'relevance', 'date' or '' for the default (relevance with text, newest without). */
  sort: string;
  /** '' for the first page. */
  page: string;
  /** Any other key (pageSize, or one the API will refuse), passed on as given. */
  rest: [string, string][];
};

const SINGLE_KEYS = new Set<string>(['q', ...RANGE_KEYS, 'rangeMode', 'allVersions', 'sort', 'page']);
const FACET_KEYS = new Set<string>(URL_FACETS);
const TRUE = new Set(['true', '1']);

export function emptyRanges(): RangeValues {
  return { tMin: '', tMax: '', bMax: '', fMin: '', fMax: '' };
}

export function emptySearch(): SearchUrlState {
  return {
    q: '', facets: { material: [], quantity: [], method: [], excitation: [], group: [], year: [] },
    ranges: emptyRanges(), rangeMode: '', allVersions: '', sort: '', page: '', rest: [],
  };
}

/**
 * Reads `?q=…&material=Cu&material=Nb&tMin=2…`. Blank values are ignored (a form's empty field); a facet may repeat
 * (values kept once, sorted, so the order of ticking does not make a different search); a single-valued key given
 * twice keeps its first non-blank value.
 */
export function stateFromParams(params: URLSearchParams): SearchUrlState {
  const state = emptySearch();
  const single = new Map<string, string>();
  for (const [key, raw] of params) {
    const value = raw.trim();
    if (value === '') continue;
    if (FACET_KEYS.has(key)) {
      const list = state.facets[key as FacetName];
      if (!list.includes(value)) list.push(value);
    } else if (SINGLE_KEYS.has(key)) {
      if (!single.has(key)) single.set(key, value);
    } else {
      state.rest.push([key, value]);
    }
  }
  for (const name of URL_FACETS) state.facets[name].sort();
  state.q = single.get('q') ?? '';
  for (const key of RANGE_KEYS) state.ranges[key] = single.get(key) ?? '';
  state.rangeMode = single.get('rangeMode') ?? '';
  state.allVersions = single.get('allVersions') ?? '';
  state.sort = single.get('sort') ?? '';
  state.page = single.get('page') ?? '';
  if (state.page === '1') state.page = '';
  state.rest.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return state;
}

/** The canonical query: fixed key order, blanks and page 1 left out. Its string is the search's key. */
export function paramsFromState(state: SearchUrlState): URLSearchParams {
  const params = new URLSearchParams();
  const put = (key: string, value: string) => {
    if (value.trim() !== '') params.append(key, value.trim());
  };
  put('q', state.q);
  for (const name of URL_FACETS) for (const value of [...new Set(state.facets[name].map((v) => v.trim()))].sort()) put(name, value);
  for (const key of RANGE_KEYS) put(key, state.ranges[key]);
  put('rangeMode', state.rangeMode);
  put('allVersions', state.allVersions);
  put('sort', state.sort);
  if (state.page.trim() !== '1') put('page', state.page);
  for (const [key, value] of state.rest) put(key, value);
  return params;
}

/** The key of a search: its canonical query string ('' for the bare page). */
export function searchKey(state: SearchUrlState): string {
  return paramsFromState(state).toString();
}

/** The page address of a search, for links, history entries and the plain-GET fallback. */
export function searchHref(state: SearchUrlState): string {
  const qs = searchKey(state);
  return qs ? `/search?${qs}` : '/search';
}

/** The order the results come in (the API's rule): without text always newest first; with text as asked, else best match. */
export function effectiveSort(state: SearchUrlState): 'relevance' | 'date' {
  if (!state.q.trim()) return 'date';
  return state.sort === 'date' ? 'date' : 'relevance';
}

export const isOverlapMode = (state: SearchUrlState) => state.rangeMode === 'overlaps';
export const includesAllVersions = (state: SearchUrlState) => TRUE.has(state.allVersions.toLowerCase());

/**
 * Whether a value written in the URL selects a facet bucket, the way the index compares them: materials by formula
 * key (YBa₂Cu₃O₇ = yba2cu3o7, a lab shorthand names its compounds), other facets trimmed and lower case, years as text.
 */
export function facetMatches(name: FacetName, urlValue: string, bucketValue: string): boolean {
  if (name === 'material') {
    const key = formulaKey(urlValue);
    return key === bucketValue || (FORMULA_ALIASES[key]?.includes(bucketValue) ?? false);
  }
  if (name === 'year') return urlValue.trim() === bucketValue;
  return urlValue.trim().toLowerCase() === bucketValue;
}

export function isFacetSelected(state: SearchUrlState, name: FacetName, bucketValue: string): boolean {
  return state.facets[name].some((v) => facetMatches(name, v, bucketValue));
}

// Every change but paging starts again at page 1: the old page number means nothing for a different result.
const fresh = (state: SearchUrlState, change: Partial<SearchUrlState>): SearchUrlState => ({ ...state, ...change, page: '' });

export function withText(state: SearchUrlState, q: string): SearchUrlState {
  return fresh(state, { q });
}

/** Ticks or unticks one bucket; unticking removes every URL value that selects it (Cu and cu alike). */
export function withFacet(state: SearchUrlState, name: FacetName, bucketValue: string, on: boolean): SearchUrlState {
  const current = state.facets[name];
  const kept = current.filter((v) => !facetMatches(name, v, bucketValue));
  const next = on ? (kept.length === current.length ? [...current, bucketValue] : current) : kept;
  return fresh(state, { facets: { ...state.facets, [name]: [...next].sort() } });
}

export function withRanges(state: SearchUrlState, ranges: RangeValues): SearchUrlState {
  return fresh(state, { ranges: { ...ranges } });
}

export function withRangeMode(state: SearchUrlState, overlaps: boolean): SearchUrlState {
  return fresh(state, { rangeMode: overlaps ? 'overlaps' : '' });
}

export function withAllVersions(state: SearchUrlState, all: boolean): SearchUrlState {
  return fresh(state, { allVersions: all ? 'true' : '' });
}

export function withSort(state: SearchUrlState, sort: 'relevance' | 'date'): SearchUrlState {
  return fresh(state, { sort });
}

export function withPage(state: SearchUrlState, page: number): SearchUrlState {
  return { ...state, page: page > 1 ? String(page) : '' };
}

/** "Clear": the filters go, the text and the chosen order stay. */
export function withoutFilters(state: SearchUrlState): SearchUrlState {
  return { ...emptySearch(), q: state.q, sort: state.sort };
}

/** How many filters (facet values, range bounds, the two switches) a search sets, for the filter panel's summary. */
export function filterCount(state: SearchUrlState): number {
  const facets = URL_FACETS.reduce((n, name) => n + state.facets[name].length, 0);
  const ranges = RANGE_KEYS.filter((k) => state.ranges[k] !== '').length;
  return facets + ranges + (isOverlapMode(state) ? 1 : 0) + (includesAllVersions(state) ? 1 : 0);
}

export function sameRanges(a: RangeValues, b: RangeValues): boolean {
  return RANGE_KEYS.every((k) => a[k].trim() === b[k].trim());
}
