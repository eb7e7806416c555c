// What the search page makes of the API's answers (components/search/search-answer.ts), and the documented response
// schema against real answers of the search index: the page's cards read only fields the document promises.
import { beforeAll, describe, expect, it } from 'vitest';
import { failureText, knownAnswer, problemAnswer, rememberAnswer, subscribeAnswers } from '@/components/search/search-answer';
import { buildOpenApi } from '@/lib/openapi/build-openapi';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { SearchIndex } from '@/lib/search/search-index';
import { SearchQueryError, type SearchResult } from '@/lib/search/types';
import { documentAjv } from '@/tests/unit/openapi/document-ajv';
import { FIXTURE } from '@/tests/unit/search/fixtures';

describe('a refused query in plain words', () => {
  it('joins the message and the field errors, as the page shows them', () => {
    let error: unknown;
    try {
      parseSearchQuery(new URLSearchParams('tMin=300&tMax=2'));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SearchQueryError);
    const answer = problemAnswer((error as SearchQueryError).message, (error as SearchQueryError).details?.fieldErrors);
    expect(answer).toEqual({
      kind: 'problem',
      message: 'A range in the search has its ends swapped. The lowest temperature (300 K) is above the highest (2 K).',
      fieldErrors: { tMin: 'The lowest temperature (300 K) is above the highest (2 K).' },
    });
  });

  it('says only the message when there are no field errors', () => {
    expect(problemAnswer('Some search parameters are not valid.', undefined)).toEqual({ kind: 'problem', message: 'Some search parameters are not valid.', fieldErrors: {} });
  });
});

describe('an answer that is neither results nor a query problem', () => {
  it('passes on the rate limiter\'s message, which says when to come back', () => {
    const body = { error: { code: 'rate_limited', message: 'Too many requests: the limit is 120 a minute. Try again in 12 s.', requestId: 'r1' } };
    expect(failureText(429, body)).toBe('Too many requests: the limit is 120 a minute. Try again in 12 s.');
  });

  it('names a server failure by its status, never with its details', () => {
    expect(failureText(503, { error: { message: 'connect ECONNREFUSED 127.0.0.1:3306' } })).toBe('The search service did not answer (HTTP 503). Try again in a moment.');
    expect(failureText(502, null)).toBe('The search service did not answer (HTTP 502). Try again in a moment.');
    expect(failureText(404, null)).toBe('The search could not be run (HTTP 404).');
  });
});

describe('answers kept for Back and Forward', () => {
  it('keeps the 40 most recently used and tells subscribers of each new one', () => {
    let told = 0;
    const stop = subscribeAnswers(() => told++);
    const answer = (n: number) => problemAnswer(`answer ${n}`, undefined);
    for (let n = 0; n < 45; n++) rememberAnswer(`q=${n}`, answer(n));
    expect(told).toBe(45);
    expect(knownAnswer('q=4')).toBeUndefined();
    expect(knownAnswer('q=5')).toEqual(answer(5));
    rememberAnswer('q=5', answer(5)); // used again: now the most recent
    rememberAnswer('q=45', answer(45));
    expect(knownAnswer('q=5')).toEqual(answer(5));
    expect(knownAnswer('q=6')).toBeUndefined();
    stop();
    rememberAnswer('q=46', answer(46));
    expect(told).toBe(47);
  });
});

describe('the documented search response against real answers', () => {
  const doc = buildOpenApi();
  const { compileRef } = documentAjv(doc);
  const validate = compileRef('#/components/schemas/SearchResult');
  let index: SearchIndex;
  beforeAll(() => {
    index = new SearchIndex();
    for (const d of FIXTURE) index.add(d);
  });
  // Through JSON, as the route sends it.
  const answer = (qs: string) => JSON.parse(JSON.stringify(index.search(parseSearchQuery(new URLSearchParams(qs))))) as SearchResult;

  it('validates answers with text, facets, ranges and every version', () => {
    for (const qs of ['', 'q=copper+wire', 'material=Cu&tMin=2&tMax=300', 'q=manganite&allVersions=true', 'group=cobalt-ridge-magnetotransport&bMax=9&sort=date']) {
      const body = answer(qs);
      expect(body.hits.length, qs).toBeGreaterThan(0);
      expect({ qs, errors: validate(body) ? null : validate.errors }).toEqual({ qs, errors: null });
    }
  });

  it('carries what a result card shows: methods, excitation, year, sparkline and temperature span', () => {
    const hit = answer('q=copper+wire').hits.find((h) => h.doc.versionId === 'a1')!;
    // Values from the fixture table (tests/unit/search/fixtures.ts, row a1).
    expect(hit.doc.methods).toEqual(['four-wire']);
    expect(hit.doc.excitation).toBe('dc-reversal');
    expect(hit.doc.year).toBe(2025);
    expect(hit.doc.temperatureSpanK).toEqual([2, 300]);
    expect(hit.doc.sparkline?.length).toBe(3);
    expect(hit.highlights.title?.some((s) => s.match && /copper/i.test(s.text))).toBe(true);
  });

  it('refuses an answer missing a field the cards read (the check can fail)', () => {
    const body = answer('');
    const doc: Record<string, unknown> = { ...body.hits[0].doc };
    delete doc.methods;
    expect(validate({ ...body, hits: [{ ...body.hits[0], doc }] })).toBe(false);
    expect(validate({ ...body, facets: { ...body.facets, year: [{ value: 2025, count: 1 }] } })).toBe(false);
  });
});
