// The search page's URL <-> state mapping (components/search/search-url.ts): what a shared address means, the
// canonical query the page sends to /api/v1/search (and keeps answers under), and how each control changes it.
import { describe, expect, it } from 'vitest';
import {
  effectiveSort, emptySearch, facetMatches, filterCount, includesAllVersions, isFacetSelected, isOverlapMode, paramsFromState,
  searchHref, searchKey, stateFromParams, withAllVersions, withFacet, withoutFilters, withPage, withRangeMode, withRanges, withSort,
  withText,
} from '@/components/search/search-url';
import { parseSearchQuery } from '@/lib/search/parse-query';

const read = (qs: string) => stateFromParams(new URLSearchParams(qs));
const key = (qs: string) => searchKey(read(qs));

describe('reading a search URL', () => {
  it('reads text, repeated facets, ranges, switches, order and page', () => {
    const s = read('q=Bi2Se3+Hall&material=Nb&material=Cu&group=larkspur-cryogenic&tMin=2&tMax=300&bMax=9&fMin=5&fMax=15&rangeMode=overlaps&allVersions=true&sort=date&page=3');
    expect(s.q).toBe('Bi2Se3 Hall');
    expect(s.facets.material).toEqual(['Cu', 'Nb']); // sorted: the order of ticking makes no different search
    expect(s.facets.group).toEqual(['larkspur-cryogenic']);
    expect(s.facets.quantity).toEqual([]);
    expect(s.ranges).toEqual({ tMin: '2', tMax: '300', bMax: '9', fMin: '5', fMax: '15' });
    expect([s.rangeMode, s.allVersions, s.sort, s.page]).toEqual(['overlaps', 'true', 'date', '3']);
    expect(isOverlapMode(s)).toBe(true);
    expect(includesAllVersions(s)).toBe(true);
  });

  it('ignores blank fields of a plain GET form and keeps one copy of a repeated facet value', () => {
    const s = read('q=&tMin=&tMax=300&material=Cu&material=Cu&material=+&rangeMode=&sort=');
    expect(s.q).toBe('');
    expect(s.facets.material).toEqual(['Cu']);
    expect(s.ranges).toEqual({ tMin: '', tMax: '300', bMax: '', fMin: '', fMax: '' });
    expect(searchKey(s)).toBe('material=Cu&tMax=300');
  });

  it('keeps a malformed value as written, so the API can say what is wrong with it', () => {
    const s = read('tMin=abc&sort=sideways&page=zero&pageSize=5&colour=red');
    expect(s.ranges.tMin).toBe('abc');
    expect(s.sort).toBe('sideways');
    expect(s.page).toBe('zero');
    expect(s.rest).toEqual([['colour', 'red'], ['pageSize', '5']]);
    expect(searchKey(s)).toBe('tMin=abc&sort=sideways&page=zero&colour=red&pageSize=5');
    expect(() => parseSearchQuery(new URLSearchParams(searchKey(s)))).toThrow('Some search parameters are not valid.');
  });

  it('takes the first non-blank value of a key that holds one value', () => {
    expect(read('q=&q=copper&q=nickel').q).toBe('copper');
    expect(read('tMin=2&tMin=4').ranges.tMin).toBe('2');
  });

  it('reads "true" and "1" as including earlier versions, as the API does', () => {
    expect(includesAllVersions(read('allVersions=1'))).toBe(true);
    expect(includesAllVersions(read('allVersions=TRUE'))).toBe(true);
    expect(includesAllVersions(read('allVersions=false'))).toBe(false);
    expect(includesAllVersions(read(''))).toBe(false);
  });
});

describe('the canonical query', () => {
  it('is the same for every spelling of one search: key order, facet order, page 1, blanks and padding', () => {
    const a = key('tMax=300&q=copper&material=Nb&material=Cu&page=1');
    expect(key('q=+copper+&material=Cu&material=Nb&tMax=300&tMin=')).toBe(a);
    expect(a).toBe('q=copper&material=Cu&material=Nb&tMax=300');
  });

  it('tells different searches apart', () => {
    expect(key('q=copper&page=2')).not.toBe(key('q=copper'));
    expect(key('q=copper&sort=date')).not.toBe(key('q=copper'));
    expect(key('material=Cu')).not.toBe(key('group=Cu'));
  });

  it('is the empty string and the bare address for the empty search', () => {
    expect(searchKey(emptySearch())).toBe('');
    expect(searchHref(emptySearch())).toBe('/search');
    expect(searchHref(read('q=niobium wire&year=2025'))).toBe('/search?q=niobium+wire&year=2025');
  });

  it('survives a round trip through the URL', () => {
    const qs = 'q=Hall+bar&quantity=hall-resistance&method=hall-bar&excitation=ac&year=2026&bMax=14&fMin=5&fMax=15&rangeMode=overlaps&sort=relevance&page=2&pageSize=50';
    const once = read(qs);
    expect(stateFromParams(paramsFromState(once))).toEqual(once);
  });

  it('means to the API what the original address means (the server page parses the canonical form)', () => {
    const addresses = [
      'q=copper',
      'material=Nb&material=Cu&tMin=2&tMax=300',
      'group=tidewater-thin-films&year=2025&sort=date&page=2&pageSize=5',
      'bMax=9&fMin=10&fMax=20&rangeMode=overlaps&allVersions=1',
      'q=&tMin=&quantity=resistivity',
    ];
    for (const qs of addresses) {
      const direct = parseSearchQuery(new URLSearchParams(qs));
      for (const list of ['material', 'quantity', 'method', 'excitation', 'group', 'year'] as const) direct[list]?.sort();
      expect(parseSearchQuery(new URLSearchParams(key(qs))), qs).toEqual(direct);
    }
  });
});

describe('matching URL values to facet buckets', () => {
  it('compares materials by formula key: subscripts, case and spaces do not matter', () => {
    expect(facetMatches('material', 'YBa₂Cu₃O₇', 'yba2cu3o7')).toBe(true);
    expect(facetMatches('material', 'YBa2 Cu3 O7', 'yba2cu3o7')).toBe(true);
    expect(facetMatches('material', 'Cu', 'cu')).toBe(true);
    expect(facetMatches('material', 'CuNi', 'cu')).toBe(false);
  });

  it('lets a lab shorthand select the compounds it names (lib/search/normalise-formula.ts aliases)', () => {
    expect(facetMatches('material', 'LSMO', 'la07sr03mno3')).toBe(true);
    expect(facetMatches('material', 'YBCO', 'yba2cu3o7')).toBe(true);
    expect(facetMatches('material', 'YBCO', 'la07sr03mno3')).toBe(false);
  });

  it('compares other facets trimmed and in lower case, years as text', () => {
    expect(facetMatches('method', ' Four-Wire ', 'four-wire')).toBe(true);
    expect(facetMatches('group', 'Larkspur-Cryogenic', 'larkspur-cryogenic')).toBe(true);
    expect(facetMatches('year', '2025', '2025')).toBe(true);
    expect(facetMatches('year', '2025', '2026')).toBe(false);
  });

  it('shows a bucket ticked when any URL value selects it', () => {
    const s = read('material=Cu&group=Larkspur-Cryogenic');
    expect(isFacetSelected(s, 'material', 'cu')).toBe(true);
    expect(isFacetSelected(s, 'group', 'larkspur-cryogenic')).toBe(true);
    expect(isFacetSelected(s, 'group', 'tidewater-thin-films')).toBe(false);
  });
});

describe('changes the controls make', () => {
  const start = read('q=film&material=Cu&tMin=2&sort=date&page=3');

  it('ticking adds the bucket value; unticking removes every URL value that selects it; both go back to page 1', () => {
    const ticked = withFacet(start, 'group', 'larkspur-cryogenic', true);
    expect(ticked.facets.group).toEqual(['larkspur-cryogenic']);
    expect(ticked.page).toBe('');
    expect(withFacet(start, 'material', 'cu', true).facets.material).toEqual(['Cu']); // already selected as "Cu"
    const both = read('material=Cu&material=cu&material=Nb');
    expect(withFacet(both, 'material', 'cu', false).facets.material).toEqual(['Nb']);
    expect(searchKey(withFacet(ticked, 'group', 'larkspur-cryogenic', false))).toBe('q=film&material=Cu&tMin=2&sort=date');
  });

  it('text, ranges, the range mode, earlier versions and the order each start again at page 1', () => {
    expect(searchKey(withText(start, 'copper film'))).toBe('q=copper+film&material=Cu&tMin=2&sort=date');
    expect(searchKey(withRanges(start, { tMin: '5', tMax: '200', bMax: '', fMin: '', fMax: '' }))).toBe('q=film&material=Cu&tMin=5&tMax=200&sort=date');
    expect(searchKey(withRangeMode(start, true))).toBe('q=film&material=Cu&tMin=2&rangeMode=overlaps&sort=date');
    expect(searchKey(withRangeMode(withRangeMode(start, true), false))).toBe('q=film&material=Cu&tMin=2&sort=date');
    expect(searchKey(withAllVersions(start, true))).toBe('q=film&material=Cu&tMin=2&allVersions=true&sort=date');
    expect(searchKey(withSort(start, 'relevance'))).toBe('q=film&material=Cu&tMin=2&sort=relevance');
  });

  it('paging keeps everything else; page 1 is the bare search', () => {
    expect(searchKey(withPage(start, 4))).toBe('q=film&material=Cu&tMin=2&sort=date&page=4');
    expect(searchKey(withPage(start, 1))).toBe('q=film&material=Cu&tMin=2&sort=date');
  });

  it('Clear drops the filters and keeps the text and the chosen order', () => {
    const cleared = withoutFilters(read('q=film&material=Cu&group=x&tMin=2&rangeMode=overlaps&allVersions=true&sort=date&page=2&pageSize=5'));
    expect(searchKey(cleared)).toBe('q=film&sort=date');
    expect(filterCount(cleared)).toBe(0);
  });

  it('counts the filters set: facet values, range bounds and the two switches', () => {
    expect(filterCount(read('q=film&material=Cu&material=Nb&tMin=2&tMax=300&rangeMode=overlaps&allVersions=true&sort=date'))).toBe(6);
    expect(filterCount(read('q=film&rangeMode=covers'))).toBe(0);
  });
});

describe('the order the results come in (lib/search/search-index.ts: no words, no relevance)', () => {
  it('is best match with text unless newest is asked for, and newest first without text', () => {
    expect(effectiveSort(read('q=copper'))).toBe('relevance');
    expect(effectiveSort(read('q=copper&sort=date'))).toBe('date');
    expect(effectiveSort(read('material=Cu'))).toBe('date');
    expect(effectiveSort(read('material=Cu&sort=relevance'))).toBe('date');
  });
});
