// Display words for the facet values the index stores as slugs (lib/search/build-search-doc.ts): the trade's spelling
// (van der Pauw, Hall, RRR), anything unlisted shown with its hyphens as spaces.
import type { FacetBucket, FacetName } from '@/lib/search/types';

export const METHOD_WORDS: Readonly<Record<string, string>> = {
  'four-wire': 'four-wire', 'two-wire': 'two-wire', 'van-der-pauw': 'van der Pauw', 'hall-bar': 'Hall bar',
};
export const EXCITATION_WORDS: Readonly<Record<string, string>> = { dc: 'DC', 'dc-reversal': 'DC with reversal', ac: 'AC lock-in' };
const QUANTITY_WORDS: Readonly<Record<string, string>> = {
  rrr: 'RRR (residual-resistivity ratio)', 'hall-effect': 'Hall effect', 'hall-resistance': 'Hall resistance',
};
const WORDS: Partial<Record<FacetName, Readonly<Record<string, string>>>> = {
  method: METHOD_WORDS, excitation: EXCITATION_WORDS, quantity: QUANTITY_WORDS,
};

/** The text a facet bucket shows: the index's label (group name, formula as written), else the words for its value. */
export function facetLabel(name: FacetName, bucket: FacetBucket): string {
  if (bucket.label) return bucket.label;
  return WORDS[name]?.[bucket.value] ?? (name === 'year' ? bucket.value : bucket.value.replace(/-/g, ' '));
}
