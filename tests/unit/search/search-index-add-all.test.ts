// SearchIndex.addAll (a rebuild, keys numbered on a worker thread) must give the same index as add() one version at a
// time: every answer is compared. The worker runs the source text of makeTokeniser and makeKeyNumbering, so they must
// also work evaluated on their own, with nothing from their modules around them.
import vm from 'node:vm';
import { afterEach, describe, expect, it } from 'vitest';
import { searchCorpus } from '@/bench/search-corpus';
import { makeKeyNumbering } from '@/lib/search/key-numbering';
import { type KeyNumberer, startKeyWorker } from '@/lib/search/key-worker';
import { materialKeys } from '@/lib/search/normalise-formula';
import { SearchIndex } from '@/lib/search/search-index';
import { FieldKeys, fieldsAt, versionText } from '@/lib/search/text-match';
import { makeTokeniser } from '@/lib/search/tokenise';
import type { SearchDoc, SearchQuery } from '@/lib/search/types';
import { byId, FIXTURE } from './fixtures';

const QUERIES: SearchQuery[] = [
  {},
  { q: 'Cu' },
  { q: 'film resistivity' },
  { q: 'hall', sort: 'date' },
  { q: 'La0.7Sr0.3MnO3', allVersions: true },
  { tMin: 4, tMax: 300, rangeMode: 'overlaps' },
  { method: ['four-wire'], group: ['larkspur-cryogenic', 'tidewater-thin-films'], pageSize: 100 },
  { q: 'copy', pageSize: 100, page: 3 },
  { q: 'corrected', allVersions: true, pageSize: 100 },
  { q: 'once', allVersions: true },
  { q: 'sweep fourteen', pageSize: 100 },
];

function answers(index: SearchIndex, docs: readonly SearchDoc[]) {
  return {
    size: index.size,
    results: QUERIES.map((q) => index.search(q)),
    docs: [...new Set(docs.map((d) => d.versionId))].map((id) => index.get(id)),
  };
}

function oneByOne(docs: readonly SearchDoc[]): SearchIndex {
  const index = new SearchIndex();
  for (const doc of docs) index.add(doc);
  return index;
}

// Copies of the fixture under new ids, titles and dates: enough for several of addAll's batches.
const copies = (n: number): SearchDoc[] =>
  Array.from({ length: n }, (_, i) => {
    const base = FIXTURE[i % FIXTURE.length];
    return {
      ...base,
      versionId: `${base.versionId}-copy${i}`,
      datasetId: `${base.datasetId}-copy${i}`,
      title: `${base.title} (copy ${i})`,
      description: `Copy of a fixture version, sweep ${['nine', 'fourteen', 'twenty'][i % 3]}.`,
      publishedAt: new Date(Date.parse(base.publishedAt) + i * 60_000).toISOString(),
    };
  });

/** 1,500 versions with a version given twice and replacements of earlier ones, the later one winning. */
function awkwardRebuild(): SearchDoc[] {
  const docs = copies(1500);
  docs.splice(900, 0, { ...docs[850], title: 'Niobium film, corrected title', description: 'corrected once' });
  docs.push({ ...docs[10], title: 'Corrected again', isLatest: false });
  return [...FIXTURE.slice(0, 4), { ...byId('a1'), title: 'Copper wire, corrected', keywords: ['corrected'] }, ...FIXTURE.slice(4), ...docs];
}

let keyer: KeyNumberer | null = null;
afterEach(() => keyer?.stop());

describe('SearchIndex.addAll', () => {
  it('with the key worker, gives the same index as adding one by one', async () => {
    const docs = awkwardRebuild();
    keyer = startKeyWorker();
    expect(keyer).not.toBeNull();
    const all = new SearchIndex({ capacity: 16 }); // and grows while adding
    const { keyedByWorker } = await all.addAll(docs, keyer);
    expect(keyedByWorker).toBeGreaterThan(1000); // all but the replacements and duplicates
    expect(answers(all, docs)).toEqual(answers(oneByOne(docs), docs));
    expect(all.get('a1')?.title).toBe('Copper wire, corrected');
    expect(all.get(docs.find((d) => d.description === 'corrected once')!.versionId)?.description).toBe('corrected once');
    expect(all.search({ q: 'corrected', allVersions: true }).total).toBe(3);
  });

  it('keys the rest on this thread when the worker fails part way, and without a worker at all', async () => {
    const docs = awkwardRebuild();
    const worker = startKeyWorker();
    keyer = worker;
    let batches = 0;
    const failing: KeyNumberer = {
      number: (versions) => (++batches === 2 ? Promise.reject(new Error('worker lost')) : worker!.number(versions)),
      stop: () => worker?.stop(),
    };
    const afterFailure = new SearchIndex();
    const { keyedByWorker } = await afterFailure.addAll(docs, failing);
    expect(batches).toBeGreaterThanOrEqual(2);
    expect(keyedByWorker).toBe(404); // the batch sent before (4 versions) and the one already sent after (400)
    const expected = answers(oneByOne(docs), docs);
    expect(answers(afterFailure, docs)).toEqual(expected);

    const alone = new SearchIndex();
    await alone.addAll(docs, null);
    expect(answers(alone, docs)).toEqual(expected);
  });
});

describe('the worker’s code on its own', () => {
  it('makeTokeniser and makeKeyNumbering run from their source alone and number keys as FieldKeys does', () => {
    const context = vm.createContext({ __name: (target: unknown) => target }); // nothing else from this module
    const numbering = vm.runInContext(
      `const makeTokeniser = ${makeTokeniser.toString()};
       const makeKeyNumbering = ${makeKeyNumbering.toString()};
       makeKeyNumbering(makeTokeniser().addKeys);`,
      context,
    ) as ReturnType<typeof makeKeyNumbering>;
    const keys = new FieldKeys();
    const corpus = searchCorpus();
    const docs = [...FIXTURE, ...Array.from({ length: 1500 }, (_, i) => corpus.make(i))];
    for (const doc of docs) {
      const keysOfMaterial = materialKeys(doc.material, doc.formula);
      const ids: number[] = [];
      numbering.number(versionText(doc, keysOfMaterial), ids);
      expect(fieldsAt(ids, 0, numbering.keyOf).fields).toEqual(keys.fields(doc, keysOfMaterial));
    }
  });
});
