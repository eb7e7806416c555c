// Reads search parameters from a URL and checks them against schemas/api/search-query.schema.json (Ajv, via
// validateWith, which is browser-safe), plus the checks a schema cannot express (a range whose ends are swapped).
import schema from '@/schemas/api/search-query.schema.json';
import { validateWith } from '@/lib/validation/validate';
import { FACET_NAMES, SearchQueryError, type SearchQuery } from './types';

export const DEFAULT_PAGE_SIZE = 20;

const LIST_KEYS = new Set<string>(FACET_NAMES);
const NUMBER_KEYS = new Set(['tMin', 'tMax', 'bMax', 'fMin', 'fMax', 'page', 'pageSize']);
const BOOLEAN_KEYS = new Set(['allVersions']);
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;
const BOOLEAN: Record<string, boolean> = { true: true, '1': true, false: false, '0': false };

/**
 * The query of `?q=…&material=…&material=…&tMin=…`: repeated keys for several facet values, empty values ignored
 * (a form's blank field), numbers and booleans parsed. Throws SearchQueryError (HTTP 400) with field errors.
 */
export function parseSearchQuery(params: URLSearchParams): SearchQuery {
  const raw: Record<string, unknown> = {};
  for (const key of new Set(params.keys())) {
    const values = params.getAll(key).map((v) => v.trim()).filter((v) => v !== '');
    if (LIST_KEYS.has(key)) {
      if (values.length) raw[key] = values;
      continue;
    }
    if (values.length === 0) continue;
    // A single-valued key given twice stays an array, which the schema reports as the wrong type.
    const value = values.length === 1 ? values[0] : values;
    if (typeof value === 'string' && NUMBER_KEYS.has(key) && NUMBER.test(value)) raw[key] = Number(value);
    else if (typeof value === 'string' && BOOLEAN_KEYS.has(key) && value.toLowerCase() in BOOLEAN) raw[key] = BOOLEAN[value.toLowerCase()];
    else raw[key] = value;
  }
  return validateSearchQuery(raw);
}

/** Checks a query object (from the URL or from code); returns it unchanged when valid, else throws SearchQueryError. */
export function validateSearchQuery(input: unknown): SearchQuery {
  const checked = validateWith<SearchQuery>(schema, input);
  if (!checked.ok) throw new SearchQueryError('Some search parameters are not valid.', checked.fieldErrors);
  const query = checked.value;
  const fieldErrors: Record<string, string> = {};
  if (query.tMin !== undefined && query.tMax !== undefined && query.tMin > query.tMax) {
    fieldErrors.tMin = `The lowest temperature (${query.tMin} K) is above the highest (${query.tMax} K).`;
  }
  if (query.fMin !== undefined && query.fMax !== undefined && query.fMin > query.fMax) {
    fieldErrors.fMin = `The lowest frequency (${query.fMin} Hz) is above the highest (${query.fMax} Hz).`;
  }
  if (Object.keys(fieldErrors).length) throw new SearchQueryError('A range in the search has its ends swapped.', fieldErrors);
  return query;
}
