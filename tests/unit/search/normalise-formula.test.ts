import { describe, expect, it } from 'vitest';
import { formulaElements, formulaKey, materialKeys } from '@/lib/search/normalise-formula';
import { MAX_TERM_CHARS, STOPWORDS, termKey, textKeys, tokenArrays, tokenSpans } from '@/lib/search/tokenise';

// Formulas and element symbols: common knowledge (IUPAC symbols); the keys are this module's own definition.
describe('formulaKey', () => {
  it('gives one key for every spelling of YBa2Cu3O7 (subscripts, case, spaces, oxygen deficit)', () => {
    for (const spelling of ['YBa2Cu3O7', 'YBa₂Cu₃O₇', 'yba2cu3o7', 'YBA2CU3O7', 'YBa2 Cu3 O7', 'YBa₂Cu₃O₇₋δ', 'YBa2Cu3O7-x', 'YBa2Cu3O7−δ']) {
      expect(formulaKey(spelling), spelling).toBe('yba2cu3o7');
    }
  });

  it('keeps fractional stoichiometry distinct but spelling-free', () => {
    expect(formulaKey('La0.7Sr0.3MnO3')).toBe('la07sr03mno3');
    expect(formulaKey('La₀.₇Sr₀.₃MnO₃')).toBe('la07sr03mno3');
    expect(formulaKey('Bi₂Se₃')).toBe(formulaKey('Bi2Se3'));
    expect(formulaKey('NbTi')).not.toBe(formulaKey('Nb'));
  });
});

describe('formulaElements', () => {
  it('splits correctly cased formulas into symbols in order of appearance', () => {
    expect(formulaElements('YBa₂Cu₃O₇₋δ')).toEqual(['Y', 'Ba', 'Cu', 'O']);
    expect(formulaElements('NbTi')).toEqual(['Nb', 'Ti']);
    expect(formulaElements('Nb')).toEqual(['Nb']);
    expect(formulaElements('La1-xSrxMnO3')).toEqual(['La', 'Sr', 'Mn', 'O']);
    expect(formulaElements('CuNi')).toEqual(['Cu', 'Ni']);
  });

  it('refuses words and lower-case text rather than guessing', () => {
    expect(formulaElements('Niobium')).toEqual([]);
    expect(formulaElements('yba2cu3o7')).toEqual([]);
    expect(formulaElements('Copper wire')).toEqual([]);
    expect(formulaElements('Qz3')).toEqual([]);
  });
});

describe('materialKeys', () => {
  it('adds the lab shorthand of a known compound', () => {
    expect(materialKeys('YBa₂Cu₃O₇₋δ thin film', 'YBa₂Cu₃O₇₋δ')).toEqual(['yba2cu3o7', 'ybco']);
    expect(materialKeys('LSMO', 'La0.7Sr0.3MnO3')).toEqual(['la07sr03mno3', 'lsmo']);
    expect(materialKeys('Niobium wire', 'Nb')).toEqual(['nb']);
  });
});

describe('tokeniser keys', () => {
  it('folds subscripts, accents and case, keeps decimal dots inside a word, drops plain plurals', () => {
    expect(textKeys('Resistivity of YBa₂Cu₃O₇ films at 4.2 K')).toEqual(['resistivity', 'yba2cu3o7', 'film', '42', 'k']);
    expect(termKey('Naïve')).toBe('naive');
    expect(termKey('analysis')).toBe('analysis');
    expect(termKey('GaAs')).toBe('gaas');
  });

  it('reduces regex and SQL metacharacters to plain words', () => {
    expect(textKeys("'; DROP TABLE users; -- .* [a-z]+ $1 \\d")).toEqual(['drop', 'table', 'user', 'z', '1', 'd']);
  });

  it('reads the same words as the reference regex, on random text with subscripts, accents, Greek and astral characters', () => {
    // Reference: the word pattern written out as a regex, keyed by termKey (tokenise.ts documents the same pattern).
    const WORD = /[\p{L}\p{N}\p{M}]+(?:(?<=\p{N})\.(?=\p{N})[\p{L}\p{N}\p{M}]+)*/gu;
    const reference = (text: string) =>
      [...text.matchAll(WORD)].map((m) => ({ start: m.index, end: m.index + m[0].length, key: termKey(m[0]) })).filter((s) => s.key);
    let seed = 12345;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const alphabet = ['a', 'Z', 's', '0', '9', '.', '.', ' ', '-', '_', 'ss', 'In', '\t', '₂', '₀', 'é', 'e\u0301', 'ρ', 'Ω', '·', '𝑥', '𝟙', '½', 'ﬁ', '中'];
    const ascii = alphabet.slice(0, 13);
    for (let n = 0; n < 1600; n++) {
      const from = n % 2 ? alphabet : ascii; // half the texts all-ASCII (the fast path), half mixed
      const text = Array.from({ length: 1 + Math.floor(next() * 30) }, () => from[Math.floor(next() * from.length)]).join('');
      expect(tokenSpans(text), JSON.stringify(text)).toEqual(reference(text));
      expect(textKeys(text)).toEqual(reference(text).map((s) => s.key).filter((key) => !STOPWORDS.has(key)));
    }
  });

  it('gives the same words as parallel arrays, keying only words that may have a wanted key length', () => {
    let seed = 777;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const alphabet = ['a', 'Z', 's', 'ss', '0', '9', '.', '.', ' ', ' ', '-', '₂', 'é', 'ρ', '–', 'x'.repeat(MAX_TERM_CHARS)];
    for (let n = 0; n < 1600; n++) {
      const from = n % 2 ? alphabet : alphabet.filter((a) => /^[\x00-\x7f]*$/.test(a));
      const text = Array.from({ length: 1 + Math.floor(next() * 40) }, () => from[Math.floor(next() * from.length)]).join('');
      const spans = tokenSpans(text);
      const lengths = new Set([1 + Math.floor(next() * 6), MAX_TERM_CHARS - Math.floor(next() * 2)]);
      const arrays = tokenArrays(text, lengths);
      expect(arrays.starts).toEqual(spans.map((s) => s.start));
      expect(arrays.ends).toEqual(spans.map((s) => s.end));
      // A word keeps its key whenever that key has a wanted length; otherwise it may be left unkeyed ('').
      spans.forEach((span, i) => {
        if (lengths.has(span.key.length)) expect(arrays.keys[i], JSON.stringify(text)).toBe(span.key);
        else expect([span.key, '']).toContain(arrays.keys[i]);
      });
      expect(tokenArrays(text).keys).toEqual(spans.map((s) => s.key));
    }
  });
});
