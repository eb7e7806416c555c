// Eight invented published versions from the three demo labs of the Meridian Transport Consortium. Every expected
// count in the search tests is hand-counted from this table.
import type { SearchDoc } from '@/lib/search/types';

const LARKSPUR = { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab' };
const TIDEWATER = { slug: 'tidewater-thin-films', name: 'Tidewater Thin Films Group' };
const COBALT = { slug: 'cobalt-ridge-magnetotransport', name: 'Cobalt Ridge Magnetotransport Lab' };

function version(v: Partial<SearchDoc> & Pick<SearchDoc, 'versionId' | 'title' | 'formula' | 'publishedAt'>): SearchDoc {
  return {
    datasetId: `ds-${v.versionId}`,
    versionNumber: 1,
    isLatest: true,
    description: '',
    keywords: [],
    material: v.formula,
    creators: [],
    group: LARKSPUR,
    quantities: ['resistivity'],
    methods: ['four-wire'],
    excitation: 'dc',
    year: Number(v.publishedAt.slice(0, 4)),
    embargoed: false,
    doi: `10.99999/ohm.${v.versionId}`,
    ranges: {},
    ...v,
  };
}

//  id    group      formula          T range (K)   |B| (T)  f (Hz)   methods        excitation  published
//  a1    larkspur   Cu               2–300         0        —        four-wire      dc-reversal 2025-03-01
//  a2    larkspur   Nb               4–20          0        —        four-wire      dc          2025-05-10
//  a3    larkspur   NbTi             2–15          —        13       two-wire       ac          2024-08-20
//  b1    tidewater  YBa₂Cu₃O₇₋δ      77–300        —        —        van-der-pauw   dc          2025-06-30 (embargoed)
//  b2v1  tidewater  La0.7Sr0.3MnO3   10–350        −9…9     17       four-wire      ac          2024-11-02 (superseded)
//  b2v2  tidewater  La0.7Sr0.3MnO3   10–350        −9…9     17       four-wire      ac          2025-02-14
//  c1    cobalt     Bi₂Se₃           1.8–50        0…14     5–15     hall-bar       ac          2026-01-09
//  c2    cobalt     CuNi             4–400         0        —        two-wire       dc          2023-04-04
export const FIXTURE: SearchDoc[] = [
  version({
    versionId: 'a1', title: 'Four-wire ρ(T) of an annealed copper wire, 2–300 K', formula: 'Cu', material: 'Copper wire',
    excitation: 'dc-reversal', publishedAt: '2025-03-01T09:00:00Z', creators: ['Ilse Varnhold'],
    keywords: ['residual resistance ratio', 'reference sample'],
    description: 'Annealed copper wire measured with current reversal to cancel thermal offsets.',
    ranges: { temperatureK: [2, 300], fieldT: [0, 0] },
    sparkline: [[2, 1.7e-10], [100, 3.5e-9], [300, 1.68e-8]], temperatureSpanK: [2, 300],
  }),
  version({
    versionId: 'a2', title: 'Niobium wire resistive transition near 9 K', formula: 'Nb', material: 'Niobium wire',
    publishedAt: '2025-05-10T12:00:00Z', ranges: { temperatureK: [4, 20], fieldT: [0, 0] },
    description: 'The superconducting transition of a niobium wire, swept slowly through 9.2 K.',
  }),
  version({
    versionId: 'a3', title: 'NbTi filament through its transition', formula: 'NbTi', methods: ['two-wire'], excitation: 'ac',
    publishedAt: '2024-08-20T08:30:00Z', ranges: { temperatureK: [2, 15], frequencyHz: [13, 13] },
  }),
  version({
    versionId: 'b1', title: 'Van der Pauw sheet resistance of a 40 nm oxide film', formula: 'YBa₂Cu₃O₇₋δ',
    material: 'YBa₂Cu₃O₇₋δ thin film', group: TIDEWATER, quantities: ['sheet-resistance'], methods: ['van-der-pauw'],
    publishedAt: '2025-06-30T16:00:00Z', embargoed: true, ranges: { temperatureK: [77, 300], thicknessM: [4e-8, 4e-8] },
  }),
  version({
    versionId: 'b2v1', datasetId: 'ds-b2', versionNumber: 1, isLatest: false, title: 'Magnetoresistance of a manganite film',
    formula: 'La0.7Sr0.3MnO3', group: TIDEWATER, quantities: ['magnetoresistance', 'resistivity'], excitation: 'ac',
    publishedAt: '2024-11-02T10:00:00Z', ranges: { temperatureK: [10, 350], fieldT: [-9, 9], frequencyHz: [17, 17] },
  }),
  version({
    versionId: 'b2v2', datasetId: 'ds-b2', versionNumber: 2, title: 'Magnetoresistance of a manganite film, recalibrated',
    formula: 'La0.7Sr0.3MnO3', group: TIDEWATER, quantities: ['magnetoresistance', 'resistivity'], excitation: 'ac',
    publishedAt: '2025-02-14T10:00:00Z', ranges: { temperatureK: [10, 350], fieldT: [-9, 9], frequencyHz: [17, 17] },
  }),
  version({
    versionId: 'c1', title: 'Hall bar Rxx and Rxy of a layered semimetal to 14 T', formula: 'Bi₂Se₃', material: 'Bi₂Se₃ flake',
    group: COBALT, quantities: ['hall-resistance', 'magnetoresistance'], methods: ['hall-bar'], excitation: 'ac',
    publishedAt: '2026-01-09T14:00:00Z', ranges: { temperatureK: [1.8, 50], fieldT: [0, 14], frequencyHz: [5, 15] },
  }),
  version({
    versionId: 'c2', title: 'Copper-nickel reference resistor', formula: 'CuNi', group: COBALT, methods: ['two-wire'],
    publishedAt: '2023-04-04T11:00:00Z', ranges: { temperatureK: [4, 400], fieldT: [0, 0] },
  }),
];

export const byId = (id: string): SearchDoc => FIXTURE.find((d) => d.versionId === id) as SearchDoc;
