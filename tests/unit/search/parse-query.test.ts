import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { errorResponse } from '@/lib/http/handler';
import { generateSearchQueryTypes, SEARCH_QUERY_TYPES_PATH } from '@/lib/search/generate-search-query-types';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { SearchQueryError } from '@/lib/search/types';

const parse = (qs: string) => parseSearchQuery(new URLSearchParams(qs));
function rejection(qs: string): SearchQueryError {
  try {
    parse(qs);
  } catch (error) {
    if (error instanceof SearchQueryError) return error;
    throw error;
  }
  throw new Error(`expected ${qs} to be rejected`);
}

describe('parseSearchQuery', () => {
  it('reads repeated keys as facet lists, numbers and booleans as such', () => {
    expect(parse('q=YBCO+film&material=Nb&material=NbTi&tMin=4.2&tMax=300&bMax=9&fMin=1e1&page=2&pageSize=50&allVersions=true&sort=date&rangeMode=overlaps'))
      .toEqual({ q: 'YBCO film', material: ['Nb', 'NbTi'], tMin: 4.2, tMax: 300, bMax: 9, fMin: 10, page: 2, pageSize: 50, allVersions: true, sort: 'date', rangeMode: 'overlaps' });
  });

  it('ignores blank values, as a form with empty fields sends them', () => {
    expect(parse('q=&material=&tMin=&group=larkspur-cryogenic')).toEqual({ group: ['larkspur-cryogenic'] });
    expect(parse('')).toEqual({});
  });

  it('keeps a 10 kB query (search shortens it with a note) and odd characters as plain text', () => {
    expect(parse(`q=${'a'.repeat(10_240)}`).q).toHaveLength(10_240);
    expect(parse(`q=${encodeURIComponent("'; DROP TABLE datasets; -- .* (?<x>) \\")}`).q).toBe("'; DROP TABLE datasets; -- .* (?<x>) \\");
  });

  it('rejects swapped ranges with a field error', () => {
    const error = rejection('tMin=300&tMax=4');
    expect(error.details?.fieldErrors).toEqual({ tMin: 'The lowest temperature (300 K) is above the highest (4 K).' });
    expect(rejection('fMin=100&fMax=10').details?.fieldErrors?.fMin).toMatch(/above the highest/);
  });

  it('rejects malformed numbers, out-of-range values, unknown sorts and unknown parameters', () => {
    expect(rejection('tMin=cold').details?.fieldErrors).toEqual({ tMin: 'This field must be a number.' });
    expect(Object.keys(rejection('tMin=-1').details?.fieldErrors ?? {})).toEqual(['tMin']);
    expect(Object.keys(rejection('page=0').details?.fieldErrors ?? {})).toEqual(['page']);
    expect(Object.keys(rejection('page=1.5').details?.fieldErrors ?? {})).toEqual(['page']);
    expect(Object.keys(rejection('page=1e10').details?.fieldErrors ?? {})).toEqual(['page']);
    expect(Object.keys(rejection('pageSize=101').details?.fieldErrors ?? {})).toEqual(['pageSize']);
    expect(rejection('sort=random').details?.fieldErrors?.sort).toBe('This field must be one of: relevance, date.');
    expect(rejection('allVersions=maybe').details?.fieldErrors?.allVersions).toBe('This field must be a boolean.');
    expect(rejection('materal=Nb').details?.fieldErrors).toEqual({ '(record)': 'Unknown field "materal".' });
    expect(Object.keys(rejection('q=a&q=b').details?.fieldErrors ?? {})).toEqual(['q']);
    expect(Object.keys(rejection(`q=${'x'.repeat(70_000)}`).details?.fieldErrors ?? {})).toEqual(['q']);
  });

  it('raises an AppError that the route wrapper answers with 400 and the field errors', async () => {
    const error = rejection('tMin=300&tMax=4');
    expect(error).toBeInstanceOf(AppError);
    expect(error.status).toBe(400);
    const response = errorResponse(error, 'req-1');
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ error: { code: 'validation_failed', requestId: 'req-1', details: { fieldErrors: { tMin: expect.any(String) } } } });
  });
});

describe('search-query types', () => {
  it('keeps lib/search/search-query.types.ts identical to what the schema generates', () => {
    const committed = readFileSync(path.resolve(import.meta.dirname, '../../..', SEARCH_QUERY_TYPES_PATH), 'utf8');
    expect(generateSearchQueryTypes()).toBe(committed);
  });
});
