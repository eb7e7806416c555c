// Group addresses from names: ASCII words joined by '-', 3–80 characters, unique by -2, -3 … (issue 8 item 3).
import { describe, expect, it } from 'vitest';
import { firstFreeSlug, slugFromName, slugProblem } from '@/lib/groups/slug';

describe('slugFromName', () => {
  it.each([
    ['Larkspur Cryogenic Lab', 'larkspur-cryogenic-lab'],
    ['  Tidewater   Thin-Films Group (2026) ', 'tidewater-thin-films-group-2026'],
    ['Ørsted Hall · Magnetotransport', 'orsted-hall-magnetotransport'],
    ['Laboratoire de Physique des Solides, équipe Éole', 'laboratoire-de-physique-des-solides-equipe-eole'],
    ['Straße & Mærsk Łódź', 'strasse-maersk-lodz'],
    ['Λ-ΩΩΩ', ''],
  ])('%s → %s', (name, slug) => {
    expect(slugFromName(name)).toBe(slug);
  });

  it('cuts a long name at a word end, never past 80 characters', () => {
    const name = 'Cobalt Ridge Magnetotransport Laboratory for High Fields and Low Temperatures at the Northern Facility';
    const slug = slugFromName(name);
    // 80 characters exactly; adding "-the" would make 84.
    expect(slug).toBe('cobalt-ridge-magnetotransport-laboratory-for-high-fields-and-low-temperatures-at');
    expect(slug.length).toBe(80);
  });
});

describe('slugProblem', () => {
  it('accepts well-formed addresses and names what is wrong with the others', () => {
    expect(slugProblem('larkspur-cryogenic')).toBeNull();
    expect(slugProblem('ab')).toBe('Use 3 to 80 characters.');
    expect(slugProblem('Larkspur')).toBe('Use lower-case letters a–z, digits and single hyphens between words.');
    expect(slugProblem('a--b')).toBe('Use lower-case letters a–z, digits and single hyphens between words.');
    expect(slugProblem('new')).toBe('"new" is the name of a page on Ohmstead; choose another.');
  });
});

describe('firstFreeSlug', () => {
  it('takes the base, then -2, -3 …, keeping 80 characters', () => {
    expect(firstFreeSlug('lab-one', new Set())).toBe('lab-one');
    expect(firstFreeSlug('lab-one', new Set(['lab-one', 'lab-one-2']))).toBe('lab-one-3');
    const long = 'x'.repeat(80);
    expect(firstFreeSlug(long, new Set([long]))).toBe(`${'x'.repeat(78)}-2`);
    const all = new Set(['abc', ...Array.from({ length: 98 }, (_, i) => `abc-${i + 2}`)]);
    expect(firstFreeSlug('abc', all)).toBeNull();
  });
});
