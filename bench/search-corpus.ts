// Deterministic synthetic published versions for the search benchmark: invented compositions, labs and people.
// Nothing here is real data; the mix (facet cardinalities, range spreads, text lengths) imitates a busy hub.
import type { SearchDoc } from '@/lib/search/types';

/** mulberry32: a small, fast, well-distributed 32-bit PRNG (public-domain reference implementation). */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SYMBOLS = 'Nb Ti Sn Ge Cu Ni Mn Fe Co Sr Ba La Y Bi Se Te Sb In As Ga Mo Ru Ir Pt Pd Zr Hf Ta V Cr Al Mg Zn Ca'.split(' ');
const FORMS = ['thin film', 'single crystal', 'wire', 'foil', 'polycrystal', 'nanowire', 'flake', 'bulk sample'];
const QUANTITIES = ['resistivity', 'sheet-resistance', 'hall-resistance', 'magnetoresistance'];
const METHODS = ['four-wire', 'two-wire', 'van-der-pauw', 'hall-bar'];
const EXCITATIONS: SearchDoc['excitation'][] = ['dc', 'dc-reversal', 'ac', 'ac', null];
const SUBSCRIPT = '₀₁₂₃₄₅₆₇₈₉';
const DOMAIN = ('resistivity transition superconducting onset anneal substrate contact geometry cryostat sweep hysteresis ' +
  'carrier density mobility anisotropy strain oxygen doping residual ratio phonon scattering kondo upturn plateau ' +
  'quantum oscillation weak localisation crossover metallic insulating epitaxial grain boundary current reversal ' +
  'thermometer calibration lock-in heating cooling field angle rotation interface disorder').split(' ');

function syllableWord(rnd: () => number, syllables: number): string {
  const c = 'bdfgklmnprstvz', v = 'aeiou';
  let w = '';
  for (let i = 0; i < syllables; i++) w += c[Math.floor(rnd() * c.length)] + v[Math.floor(rnd() * v.length)];
  return w;
}

const cap = (w: string) => w[0].toUpperCase() + w.slice(1);

/**
 * A string as the database driver hands it over: decoded afresh from UTF-8 bytes, so one flat string. (Strings built
 * by concatenation are ropes in V8 and would make the index look bigger than it is with real rows.)
 */
export const asRead = (s: string) => Buffer.from(s, 'utf8').toString('utf8');

/** A deterministic id in UUID form (36 characters, like the database's), so id strings cost what real ones do. */
export function uuidLike(seed: number, n: number, kind: number): string {
  const r = prng(seed * 7 + n * 3 + kind);
  const hex = Array.from({ length: 32 }, () => Math.floor(r() * 16).toString(16)).join('');
  return asRead(`${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-a${hex.slice(17, 20)}-${hex.slice(20)}`);
}

export type Corpus = { make(i: number): SearchDoc; materials: string[]; groups: SearchDoc['group'][]; words: string[] };

/** A generator of `count` versions; make(i) is a pure function of i (and the seed), so nothing needs to be kept. */
export function searchCorpus(seed = 7): Corpus {
  const rnd = prng(seed);
  const pick = <T>(list: readonly T[], r = rnd) => list[Math.floor(r() * list.length)];
  const words = Array.from({ length: 2500 }, (_, i) => syllableWord(rnd, 2 + (i % 3)));
  const materials = Array.from({ length: 3000 }, () => {
    const n = 1 + Math.floor(rnd() * 4);
    return Array.from({ length: n }, () => pick(SYMBOLS) + (rnd() < 0.5 ? String(1 + Math.floor(rnd() * 7)) : '')).join('');
  });
  const groups = Array.from({ length: 40 }, () => {
    const name = `${cap(syllableWord(rnd, 3))} ${pick(['Transport', 'Cryogenic', 'Thin Films', 'Magnetotransport', 'Quantum Materials'])} Lab`;
    return { slug: asRead(name.toLowerCase().replace(/[^a-z]+/g, '-').replace(/-$/, '')), name: asRead(name) };
  });
  const people = Array.from({ length: 2000 }, () => asRead(`${cap(syllableWord(rnd, 2))} ${cap(syllableWord(rnd, 3))}`));
  const keywords = [...DOMAIN, ...words.slice(0, 300)];

  function make(i: number): SearchDoc {
    const r = prng(seed * 1_000_003 + i);
    const datasetIndex = Math.floor(i / 2);
    const formula = materials[Math.floor(r() ** 2 * materials.length)]; // popular materials first
    const spelled = r() < 0.3 ? formula.replace(/\d/g, (d) => SUBSCRIPT[Number(d)]) : formula;
    const form = pick(FORMS, r);
    const quantities = QUANTITIES.filter(() => r() < 0.4);
    if (quantities.length === 0) quantities.push(pick(QUANTITIES, r));
    const methods = [pick(METHODS, r), ...(r() < 0.2 ? [pick(METHODS, r)] : [])];
    const excitation = pick(EXCITATIONS, r);
    const year = 2018 + Math.floor(r() * 9);
    const group = groups[Math.floor(r() ** 1.5 * groups.length)];
    const tLo = 0.3 * 10 ** (r() * 2.5), tHi = Math.min(400, tLo * 10 ** (0.3 + r() * 2.5));
    const bHi = r() < 0.6 ? 0 : Math.round(1 + r() * 29);
    const fHz = excitation === 'ac' ? Math.round(7 + r() * 1000) : undefined;
    const word = () => pick(words, r);
    const domain = () => pick(DOMAIN, r);
    const kelvin = (t: number) => (t < 10 ? t.toFixed(1) : String(Math.round(t)));
    // Two or three sentences of lab prose (~300 characters, function words included) built from the pools above.
    const sentences = [
      () => `The ${form} was ${domain()} on a ${word()} substrate and ${domain()} before the ${domain()} sweep.`,
      () => `A ${domain()} ${domain()} appears near ${kelvin(tLo * 2)} K, with a ${word()} ${domain()} below it.`,
      () => `Contacts were made with ${word()} paste; the ${domain()} is ${word()} across the ${domain()}.`,
      () => `Data were taken in the ${word()} cryostat with the ${domain()} checked against a ${word()} ${domain()}.`,
      () => `Field sweeps reached ${bHi || 1} T at ${(0.1 + r()).toFixed(2)} T per minute to limit ${domain()}.`,
      () => `We compare the ${domain()} with a ${word()} ${domain()} model and note the ${word()} ${domain()}.`,
    ];
    const first = Math.floor(r() * sentences.length), step = r() < 0.5 ? 1 : sentences.length - 1; // no sentence twice
    const prose = Array.from({ length: 2 + Math.floor(r() * 2) }, (_, k) => sentences[(first + k * step) % sentences.length]()).join(' ');
    const doc: SearchDoc = {
      versionId: uuidLike(seed, i, 1),
      datasetId: uuidLike(seed, datasetIndex, 2),
      versionNumber: 1 + (i % 2),
      isLatest: i % 2 === 1 || r() < 0.3,
      title: asRead(`${cap(pick(quantities, r).replace(/-/g, ' '))} of a ${spelled} ${form}, ${kelvin(tLo)}–${kelvin(tHi)} K: ${domain()} ${word()}`),
      description: asRead(`We measured the ${quantities.join(' and ').replace(/-/g, ' ')} of a ${form} of ${spelled} between ` +
        `${kelvin(tLo)} and ${kelvin(tHi)} K using the ${methods[0].replace(/-/g, ' ')} method. ${prose}`),
      keywords: Array.from({ length: 3 + Math.floor(r() * 3) }, () => pick(keywords, r)),
      material: asRead(`${spelled} ${form}`),
      formula,
      creators: r() < 0.1 ? [] : Array.from({ length: 1 + Math.floor(r() * 4) }, () => pick(people, r)),
      group,
      quantities,
      methods,
      excitation,
      year,
      publishedAt: asRead(new Date(Date.UTC(year, 0, 1) + Math.floor(r() * 364 * 86_400_000)).toISOString()),
      embargoed: r() < 0.1,
      doi: asRead(`10.99999/ohm.${i}`),
      ranges: {
        temperatureK: [tLo, tHi],
        ...(bHi ? { fieldT: [r() < 0.5 ? -bHi : 0, bHi] as [number, number] } : { fieldT: [0, 0] as [number, number] }),
        ...(fHz ? { frequencyHz: [fHz, fHz] as [number, number] } : {}),
        ...(form.includes('film') ? { thicknessM: [1e-9 * (5 + r() * 200), 1e-9 * (5 + r() * 200)] as [number, number] } : {}),
      },
      sparkline: Array.from({ length: 64 }, (_, k) => {
        const t = tLo + ((tHi - tLo) * k) / 63;
        return [t, 1e-7 * (1 + t / 100) * (1 + 0.01 * r())] as [number, number];
      }),
      temperatureSpanK: [tLo, tHi],
    };
    return doc;
  }

  return { make, materials, groups, words };
}
