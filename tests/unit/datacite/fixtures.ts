import type { DataCiteInput } from '@/lib/datacite';
import type { TransportDataset } from '@/lib/schema';

// Invented demo data (Meridian Transport Consortium). ORCID iDs sit in the unissued 0000-0000 block with valid
// ISO 7064 MOD 11-2 check digits (lib/schema/orcid.ts); ROR IDs are in ROR's 0xxxxxxxx form with a deliberately
// wrong checksum, so none can name a real person or organisation.
export const ORCID_BRACKENRIDGE = '0000-0000-2718-2810';
export const ORCID_HOLT = 'https://orcid.org/0000-0000-1618-0334';
export const ORCID_PEMBERTON = '0000-0000-3141-5920';
export const ROR_LARKSPUR = 'https://ror.org/0mtc4kq17';
export const ROR_TIDEWATER = 'https://ror.org/0tdw8fh52';
export const ROR_COBALT = 'https://ror.org/0crm3bv08';
export const ROR_FUNDER = 'https://ror.org/0nsc2wq64';
export const ROR_HUB = 'https://ror.org/0hvb7ge31';

const base = {
  publisher: { name: 'Ohmstead' },
  publicationYear: 2026,
  publishedAt: '2026-03-14T09:30:00Z',
};

export function minimalInput(): DataCiteInput {
  return {
    ...base,
    doi: '10.99999/ohm.min1-v1',
    kind: 'version',
    conceptDoi: '10.99999/ohm.min1',
    versionNumber: 1,
    record: {
      title: 'Sheet resistance of a sputtered NbN film at 4 K',
      creators: [{ name: 'Odile Brackenridge' }],
      sample: { name: 'TTF-NbN-03' },
      measurement: { quantity: 'sheet-resistance' },
    },
    group: { name: 'Tidewater Thin Films Group' },
    files: [],
    landingUrl: 'https://ohmstead.example/datasets/min1/v1',
  };
}

export const FULL_RECORD: TransportDataset = {
  title: 'Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K',
  description: 'Four-wire **R(B)** sweeps of an exfoliated flake.\n\nTwo cooldowns; see the methods note.',
  creators: [
    { name: 'Odile Brackenridge', orcid: ORCID_BRACKENRIDGE, affiliation: [{ name: 'Cobalt Ridge Magnetotransport Lab', rorId: ROR_COBALT }] },
    { name: 'Casimir van der Holt', orcid: ORCID_HOLT, affiliation: [{ name: 'Cobalt Ridge Magnetotransport Lab', rorId: ROR_COBALT }, { name: 'Meridian Transport Consortium' }] },
    { name: 'Pemberton, Yusra', orcid: ORCID_PEMBERTON },
  ],
  keywords: ['topological insulator', 'weak antilocalisation', 'Bi2Se3'],
  license: 'CC-BY-4.0',
  relatedIdentifiers: [
    { identifier: '10.99999/meridian.paper.2026.17', identifierType: 'DOI', relationType: 'IsSupplementTo' },
    { identifier: 'https://ohmstead.example/notes/cooldown-log', identifierType: 'URL', relationType: 'IsDocumentedBy' },
    { identifier: 'arXiv:2601.01234', identifierType: 'arXiv', relationType: 'IsReferencedBy' },
  ],
  funding: [
    { funderName: 'Northmarch Science Council', funderIdentifier: ROR_FUNDER, funderIdentifierType: 'ROR', awardNumber: 'NSC-2031-417', awardTitle: 'Quantum transport in layered chalcogenides' },
    { funderName: 'Meridian Instrument Fund' },
  ],
  sample: {
    name: 'CRM-BS-F12',
    material: 'bismuth selenide',
    formula: 'Bi2Se3',
    form: 'flake',
    substrate: 'SiO2/Si',
    geometry: {
      lengthBetweenVoltageContacts: { value: 12, unit: 'um' },
      width: { value: 4, unit: 'um' },
      thickness: { value: 35, unit: 'nm' },
      crossSectionArea: { value: 0.14, unit: 'um2' },
    },
    contacts: { configuration: 'hall-bar', contactMaterial: 'Ti/Au', spacing: { value: 12, unit: 'um' } },
  },
  measurement: {
    quantity: 'magnetoresistance',
    mode: 'four-wire',
    excitation: { type: 'ac', currentAmplitude: { value: 100, unit: 'nA' }, frequency: { value: 17.77, unit: 'Hz' } },
    detection: { instrumentType: 'digital-lock-in', timeConstant: { value: 300, unit: 'ms' }, filterOrder: 4, filterSlope: 24, averagingWindow: { value: 2, unit: 's' }, averagingCount: 5 },
  },
  environment: {
    temperatureRange: { min: 1.8, max: 300, unit: 'K' },
    fieldRange: { min: -9, max: 9, unit: 'T' },
    fieldOrientation: 'out-of-plane',
    angle: { value: 0, unit: 'deg' },
    sweepVariable: 'field',
    sweepRate: { value: 0.2, unit: 'T/min' },
    sweepDirection: 'both',
  },
  columns: [
    { name: 'B', quantity: 'field', unit: 'T', role: 'x' },
    { name: 'Rxx', quantity: 'resistance', unit: 'Ohm', role: 'y' },
    { name: 'T', quantity: 'temperature', unit: 'K', role: 'aux' },
  ],
};

export function fullInput(): DataCiteInput {
  return {
    ...base,
    publisher: { name: 'Ohmstead', rorId: ROR_HUB },
    doi: '10.99999/ohm.k7p2-v2',
    kind: 'version',
    conceptDoi: '10.99999/ohm.k7p2',
    versionNumber: 2,
    previousVersionDoi: '10.99999/ohm.k7p2-v1',
    nextVersionDoi: '10.99999/ohm.k7p2-v3',
    record: structuredClone(FULL_RECORD),
    group: { name: 'Cobalt Ridge Magnetotransport Lab', rorId: ROR_COBALT },
    embargoUntil: '2026-09-01',
    withdrawn: { at: '2026-11-02T12:00:00Z', reason: 'Thermometer calibration error found' },
    files: [
      { name: 'rxx_1p8K.csv', sizeBytes: 482_113, format: 'text/csv', sha256: 'a'.repeat(64), downloadUrl: 'https://ohmstead.example/files/1' },
      { name: 'rxx_300K.csv', sizeBytes: 97_020, format: 'text/csv' },
      { name: 'README.md', sizeBytes: 2_048, format: 'text/markdown' },
    ],
    landingUrl: 'https://ohmstead.example/datasets/k7p2/v2',
    language: 'en',
  };
}

export function embargoInput(): DataCiteInput {
  return { ...minimalInput(), doi: '10.99999/ohm.emb1-v1', conceptDoi: '10.99999/ohm.emb1', embargoUntil: new Date('2027-01-15T00:00:00Z') };
}

export function conceptInput(): DataCiteInput {
  return {
    ...fullInput(),
    doi: '10.99999/ohm.k7p2',
    kind: 'concept',
    versionNumber: 3,
    previousVersionDoi: undefined,
    nextVersionDoi: undefined,
    versionDois: ['10.99999/ohm.k7p2-v1', '10.99999/ohm.k7p2-v2', '10.99999/ohm.k7p2-v3'],
    embargoUntil: null,
    withdrawn: null,
  };
}

/** Markup characters and non-ASCII in every free-text field the builders copy. */
export const SPECIAL_TITLE = `Resistivity 12 µΩ·cm of <Cu & "Ag"> films, 4 Å roughness — d'Ürsel's "Fall" & <script>`;
export function specialCharsInput(): DataCiteInput {
  const input = minimalInput();
  input.record = {
    ...input.record,
    title: SPECIAL_TITLE,
    description: 'Gain < 1 & phase > 90° for "all" sweeps; ü, Å, µΩ·cm.\u0007',
    creators: [
      { name: `Zoë O'Brien-Müller & <Co>`, orcid: `https://orcid.org/${ORCID_PEMBERTON}`, affiliation: [{ name: 'Tidewater "Thin" Films & <Group>' }] },
      { name: 'Ångström, Ümit' },
    ],
    keywords: ['µΩ·cm', 'R < 1 Ω', 'Ü & Å'],
  };
  return input;
}
