import { AppError, type FieldErrors } from '@/lib/errors';
export type { SearchQuery } from './search-query.types';

/** A closed [min, max] interval in the unit the field name carries. */
export type NumericRange = [number, number];

/** One published dataset version as the search index sees it; the caller builds it from the database. */
export type SearchDoc = {
  versionId: string;
  datasetId: string;
  versionNumber: number;
  isLatest: boolean;
  title: string;
  /** Plain text (markdown already stripped by the caller). */
  description: string;
  keywords: string[];
  /** Display name of the material, e.g. "YBa₂Cu₃O₇₋δ thin film". */
  material: string;
  /** Chemical formula as written by the depositor, e.g. "La0.7Sr0.3MnO3"; '' when unknown. */
  formula: string;
  /** Creator names; the caller leaves them out where the dataset is anonymous. */
  creators: string[];
  group: { slug: string; name: string };
  /** e.g. resistivity, sheet-resistance, hall-resistance, magnetoresistance. */
  quantities: string[];
  /** e.g. four-wire, two-wire, van-der-pauw, hall-bar. */
  methods: string[];
  excitation: 'dc' | 'dc-reversal' | 'ac' | null;
  year: number;
  /** ISO 8601 instant of publication (given back in toISOString() form, e.g. 2025-03-01T09:00:00.000Z). */
  publishedAt: string;
  /** Files under embargo: the metadata stays findable, the card shows a lock. */
  embargoed: boolean;
  doi: string | null;
  ranges: { temperatureK?: NumericRange; fieldT?: NumericRange; frequencyHz?: NumericRange; thicknessM?: NumericRange };
  /** The main curve for the result card, at most 64 [x, y] points; kept at 16-bit resolution (see sparkline-store.ts). */
  sparkline?: [number, number][];
  /** Temperature span of the main curve, for the card's log-axis bar. */
  temperatureSpanK?: NumericRange;
};

export const FACET_NAMES = ['material', 'quantity', 'method', 'excitation', 'group', 'year'] as const;
export type FacetName = (typeof FACET_NAMES)[number];

/** One facet value with its count; `label` is the display text where it differs from `value` (group name, formula). */
export type FacetBucket = { value: string; count: number; label?: string; selected?: boolean };

/** Highlighted text as plain segments, so rendering can never inject markup. */
export type HighlightSegment = { text: string; match: boolean };

export type SearchHit = {
  doc: SearchDoc;
  /** Higher is better; comparable only within one result (0 for queries without text). */
  score: number;
  highlights: { title?: HighlightSegment[]; description?: HighlightSegment[] };
};

export type SearchResult = {
  total: number;
  page: number;
  pageSize: number;
  sort: 'relevance' | 'date';
  hits: SearchHit[];
  facets: Record<FacetName, FacetBucket[]>;
  /** Plain-language notes about how the query was read (shortened, words ignored). */
  notes: string[];
};

/** The one error search raises: bad query parameters. The route answers 400 with the field errors. */
export class SearchQueryError extends AppError {
  constructor(message: string, fieldErrors: FieldErrors) {
    super('validation_failed', message, { fieldErrors });
    this.name = 'SearchQueryError';
  }

  // A malformed query string is a bad request (400), not an unprocessable body (422).
  override get status(): number {
    return 400;
  }
}
