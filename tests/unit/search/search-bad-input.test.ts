import { beforeEach, describe, expect, it } from 'vitest';
import { MAX_QUERY_CHARS, MAX_QUERY_TERMS } from '@/lib/search/query-terms';
import { SearchIndex } from '@/lib/search/search-index';
import { SearchQueryError, type SearchQuery } from '@/lib/search/types';
import { FIXTURE } from './fixtures';

// Bad input never throws anything but SearchQueryError (HTTP 400); expected ids hand-read from fixtures.ts.
let index: SearchIndex;
beforeEach(() => {
  index = new SearchIndex();
  for (const doc of FIXTURE) index.add(doc);
});

function rejected(params: unknown): SearchQueryError {
  try {
    index.search(params as SearchQuery);
  } catch (error) {
    if (error instanceof SearchQueryError) return error;
    throw error;
  }
  throw new Error('expected a SearchQueryError');
}

describe('search with bad input', () => {
  it('treats an empty or blank query as "everything, newest first"', () => {
    for (const q of [undefined, '', '   ']) {
      const result = index.search({ q });
      expect(result.total).toBe(7);
      expect(result.sort).toBe('date');
      expect(result.notes).toEqual([]);
    }
  });

  it('shortens a 10 kB query with a note and still answers', () => {
    const result = index.search({ q: `copper ${'x'.repeat(10_240)}` });
    expect(result.notes).toContain(`The search text was shortened to its first ${MAX_QUERY_CHARS} characters.`);
    expect(result.total).toBe(0); // the long word must match too
    const words = index.search({ q: Array.from({ length: 40 }, (_, i) => `w${i}`).join(' ') });
    expect(words.notes).toContain(`Only the first ${MAX_QUERY_TERMS} words were searched.`);
  });

  it('reads regex and SQL metacharacters as plain text', () => {
    expect(index.search({ q: "'; DROP TABLE datasets; --" }).total).toBe(0);
    expect(index.search({ q: 'copper.*' }).hits.map((h) => h.doc.versionId).sort()).toEqual(['a1', 'c2']);
    expect(index.search({ q: '^[copper]+$' }).hits.map((h) => h.doc.versionId).sort()).toEqual(['a1', 'c2']);
    expect(index.search({ q: '(?<x>copper)' }).total).toBe(0); // "x" is a word of its own, and nothing has it
    expect(index.search({ q: '$where: 1 OR 1=1' }).total).toBe(0);
    expect(index.search({ q: '\u0000\uffff' }).total).toBe(7);
  });

  it('lists everything with a note when the text has no words at all', () => {
    const result = index.search({ q: '.* %% ((( ;--' });
    expect(result.total).toBe(7);
    expect(result.notes).toEqual(['The search text has no words to look for, so every version is listed.']);
  });

  it('answers a page far past the end with no hits and the right total', () => {
    expect(index.search({ q: 'wire', page: 999_999 })).toMatchObject({ total: 5, hits: [] });
  });

  it('rejects swapped ranges, a too-large page size and unknown keys with a typed 400 error', () => {
    expect(rejected({ tMin: 300, tMax: 4 }).details?.fieldErrors).toHaveProperty('tMin');
    expect(rejected({ fMin: 20, fMax: 10 }).details?.fieldErrors).toHaveProperty('fMin');
    expect(rejected({ pageSize: 1000 }).status).toBe(400);
    expect(rejected({ page: 0 }).details?.fieldErrors).toHaveProperty('page');
    expect(rejected({ tMin: Number.NaN }).details?.fieldErrors).toHaveProperty('tMin');
    expect(rejected({ material: 'Nb' }).details?.fieldErrors).toHaveProperty('material');
    expect(rejected({ state: 'draft' }).details?.fieldErrors).toEqual({ '(record)': 'Unknown field "state".' });
    expect(rejected(null).status).toBe(400);
  });

  it('searches an empty index without error', () => {
    const empty = new SearchIndex();
    expect(empty.search({ q: 'anything', tMin: 4 })).toMatchObject({ total: 0, hits: [] });
    expect(empty.search({}).facets.group).toEqual([]);
  });
});
