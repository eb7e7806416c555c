// The documents a production server loaded with bench/load-fixture.ts indexes, made in process, so the search bench
// can time the same kind of documents in process as it times over HTTP. Keep in step with bench/load-fixture.ts; the
// bench compares one of them with the server's copy (bench/search.ts, checkFixtureShape).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { TransportDatasetDraft } from '@/lib/schema';
import { buildSearchDoc } from '@/lib/search/build-search-doc';
import type { SearchDoc } from '@/lib/search/types';
import { asRead, type Corpus, uuidLike } from './search-corpus';

/** The group bench/load-fixture.ts puts its versions in. */
export const FIXTURE_GROUP = { slug: 'bench-fixture', name: 'Bench fixture (synthetic load-test data, not real measurements)' };
const FIXTURE_TEMPLATE = path.join(import.meta.dirname, '..', 'tests', 'fixtures', 'transport', 'cu-wire-rt.meta.json');

/**
 * Version i as a server loaded with bench/load-fixture.ts indexes it: the row that script inserts (record from the
 * copper-wire template with the corpus's title, description and keywords; one published version per dataset; no DOI,
 * no files), read back through buildSearchDoc like the search service does. Ids are deterministic here (random there).
 */
export function fixtureDocs(corpus: Corpus, seed = 7): (i: number) => SearchDoc {
  const template = JSON.parse(readFileSync(FIXTURE_TEMPLATE, 'utf8')) as TransportDatasetDraft;
  return (i) => {
    const doc = corpus.make(i);
    const title = asRead(`[bench] ${doc.title}`.slice(0, 300));
    const record = { ...template, title, description: asRead(`Synthetic bench record ${i}. ${doc.description}`), keywords: doc.keywords };
    return buildSearchDoc({
      versionId: uuidLike(seed, i, 3), datasetId: uuidLike(seed, i, 4), versionNumber: 1, isLatest: true, title, record,
      group: FIXTURE_GROUP, publishedAt: new Date(Date.UTC(doc.year, i % 12, 1 + (i % 28), 9)), embargoUntil: null, doi: null,
      summaries: [],
    });
  };
}
