// The keys FieldKeys hands FlexSearch (text-match.ts) are exactly the tokeniser's (tokenise.ts textKeys, plus the
// material and element keys), each once per version, in the first field that has it. Checked on the search fixtures,
// on awkward hand-written text, and on 3,000 versions of the benchmark's synthetic corpus (invented text), so a faster
// key path can be swapped in against it.
import { describe, expect, it } from 'vitest';
import { searchCorpus } from '@/bench/search-corpus';
import { elementKeys, materialKeys } from '@/lib/search/normalise-formula';
import { FieldKeys } from '@/lib/search/text-match';
import { textKeys } from '@/lib/search/tokenise';
import type { SearchDoc } from '@/lib/search/types';
import { FIXTURE } from './fixtures';

/** The keys of each field, from the tokeniser's own functions. */
function expectedFields(doc: SearchDoc) {
  const seen = new Set<string>();
  const take = (keys: readonly string[], out: string[]) => {
    for (const key of keys) {
      if (seen.has(key)) continue;
      seen.add(key);
      out.push(key);
    }
  };
  const title: string[] = [];
  take(textKeys(doc.title), title);
  const head: string[] = [];
  take(materialKeys(doc.material, doc.formula), head);
  take(elementKeys(doc.formula), head);
  take(textKeys(doc.material), head);
  for (const keyword of doc.keywords) take(textKeys(keyword), head);
  for (const creator of doc.creators) take(textKeys(creator), head);
  const body: string[] = [];
  take(textKeys(doc.description), body);
  return { title, head, body };
}

const AWKWARD: Partial<SearchDoc>[] = [
  {
    title: 'Films and GLASSES of La0.7Sr0.3MnO3 at 4.2 K, 300K and 1.2.3; status, basis, class, the bus',
    description: 'Dots: .5 and 5. and x.y and 4.2.1 and a.1 — words over 32 characters: ' +
      'Supercalifragilisticexpialidociousnesses Pneumonoultramicroscopicsilicovolcanoconioses; UPPER and MiXeD case. ' +
      'Stopwords of the in at on as be by for from is it its or that the their this to was were which with we.',
    keywords: ['In', 'As', 'thin films', 'R_xx', 'n-type'],
    creators: ['Ada Penhallow', 'Maren Quillfeather'],
    material: 'Indium tin oxide films', formula: 'In2O3:Sn',
  },
  {
    title: 'ρ(T) of a YBa₂Cu₃O₇₋δ film, 10–300 K',
    description: 'Résistivité in µΩ·cm; Hall bars of Bi₂Se₃ flakes (4.2 K) and Müller cells.',
    keywords: ['Kondo', 'ÅNGSTRÖMS', 'résidus'], creators: ['Joss Merriweather'], material: 'YBa₂Cu₃O₇₋δ thin film', formula: 'YBa₂Cu₃O₇₋δ',
  },
];

describe('FieldKeys hands FlexSearch the tokeniser’s keys', () => {
  it('on the fixtures and awkward text: plurals, dots between digits, long words, case, stopwords, non-ASCII', () => {
    const keys = new FieldKeys();
    const docs = [...FIXTURE, ...AWKWARD.map((d, i) => ({ ...FIXTURE[i], ...d }) as SearchDoc)];
    for (const doc of docs) expect(keys.fields(doc, materialKeys(doc.material, doc.formula))).toEqual(expectedFields(doc));
    // The same text again gives the same keys, found in the table this time.
    const again = keys.fields(docs.at(-2)!, materialKeys(docs.at(-2)!.material, docs.at(-2)!.formula));
    expect(again).toEqual(expectedFields(docs.at(-2)!));
    // The plural rule as the tokeniser has it: films → film; status, basis and class keep their -s.
    expect(again.title).toEqual(expect.arrayContaining(['film', 'status', 'basis', 'class', 'la07sr03mno3', '42']));
  });

  it('on 3,000 versions of the synthetic benchmark corpus', () => {
    const corpus = searchCorpus();
    const keys = new FieldKeys();
    for (let i = 0; i < 3000; i++) {
      const doc = corpus.make(i);
      expect(keys.fields(doc, materialKeys(doc.material, doc.formula))).toEqual(expectedFields(doc));
    }
    expect(keys.size).toBeGreaterThan(1000);
  });
});
