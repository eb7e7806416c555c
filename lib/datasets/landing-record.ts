// Reads a stored measurement record into what the landing page shows; pure, and defensive because a draft may hold
// anything the partial schema allowed. Values keep the author's unit, written with SI prefixes (lib/format/quantity).
import { doiUrl, orcidUrl } from '@/lib/datacite/identifiers';
import { spdxLicence } from '@/lib/datacite/spdx-licences';
import { quantityLabel } from '@/lib/datacite/technical-summary';
import { formatQuantity, formatRange } from '@/lib/format/quantity';
import type { SpdxLicense, TransportDataset } from '@/lib/schema';
import type { Fact, LandingCreator, LandingRecord } from './landing-types';

type Obj = Record<string, unknown>;

const obj = (v: unknown): Obj | undefined => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Obj) : undefined);
const text = (v: unknown): string | undefined => (typeof v === 'string' && v.trim() !== '' ? v.trim() : undefined);
const finite = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
const words = (token: string) => token.replace(/-/g, ' ');

/** { value, unit } → '20 mm', '1 mA', '13.7 Hz' (up to 6 significant digits: what the author typed, not rounded). */
function amount(v: unknown): string | undefined {
  const q = obj(v);
  const value = finite(q?.value);
  const unit = text(q?.unit);
  return value === undefined || !unit ? undefined : formatQuantity(value, unit, 6);
}

function range(v: unknown): string | undefined {
  const r = obj(v);
  const [min, max, unit] = [finite(r?.min), finite(r?.max), text(r?.unit)];
  return min === undefined || max === undefined || !unit ? undefined : formatRange(min, max, unit);
}

function facts(entries: [string, string | undefined][]): Fact[] {
  return entries.filter((e): e is [string, string] => e[1] !== undefined).map(([label, value]) => ({ label, value }));
}

const CONFIGURATION: Obj = { 'four-wire-linear': 'four-wire linear', 'van-der-pauw': 'van der Pauw', 'hall-bar': 'Hall bar', 'two-wire': 'two-wire' };
const EXCITATION: Obj = { dc: 'DC', 'dc-reversal': 'DC with current reversal', ac: 'AC' };
const INSTRUMENT: Obj = { 'dc-voltmeter': 'DC voltmeter', 'analog-lock-in': 'analogue lock-in amplifier', 'digital-lock-in': 'digital lock-in amplifier' };
const MODE: Obj = { 'four-wire': 'four-wire', 'two-wire': 'two-wire' };
const ORIENTATION: Obj = {
  'out-of-plane': 'out of plane', 'in-plane-parallel-to-current': 'in plane, parallel to the current',
  'in-plane-perpendicular-to-current': 'in plane, perpendicular to the current', rotating: 'rotating', other: 'other',
};
const QUANTITIES = ['resistance', 'resistivity', 'sheet-resistance', 'hall-resistance', 'magnetoresistance', 'conductance', 'voltage', 'current-voltage', 'other'];
const pick = (table: Obj, v: unknown) => (typeof v === 'string' && typeof table[v] === 'string' ? (table[v] as string) : text(v) && words(v as string));

function relatedHref(type: string, id: string): string | null {
  if (type === 'DOI') return doiUrl(id);
  if (type === 'arXiv') return `https://arxiv.org/abs/${encodeURIComponent(id.replace(/^arxiv:/i, ''))}`;
  if (type === 'Handle') return `https://hdl.handle.net/${encodeURI(id)}`;
  // Only web addresses become links: a javascript: or data: URL stays text.
  if (type === 'URL' && /^https?:\/\//i.test(id)) return id;
  return null;
}

/** 'IsSupplementTo' → 'Is supplement to'. */
function relationWords(relation: string): string {
  const spaced = relation.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

function licence(v: unknown): LandingRecord['license'] {
  const id = text(v);
  if (!id) return null;
  try {
    const info = spdxLicence(id as SpdxLicense);
    return info.name ? info : { id, name: id, url: `https://spdx.org/licenses/${encodeURIComponent(id)}.html` };
  } catch {
    return { id, name: id, url: `https://spdx.org/licenses/${encodeURIComponent(id)}.html` };
  }
}

/** Creators as the header lists them; entries without a name are skipped. */
export function readCreators(metadata: unknown): LandingCreator[] {
  return list(obj(metadata)?.creators).flatMap((c): LandingCreator[] => {
    const name = text(obj(c)?.name);
    if (!name) return [];
    const orcid = text(obj(c)?.orcid) ?? null;
    const affiliations = list(obj(c)?.affiliation).map((a) => text(obj(a)?.name)).filter((a): a is string => Boolean(a));
    return [{ name, orcid, orcidUrl: orcid ? orcidUrl(orcid) : null, affiliations }];
  });
}

/** The description, keywords, licence, links and the sample and measurement cards of a record. */
export function readLandingRecord(metadata: unknown, opts: { hideRelated?: boolean } = {}): LandingRecord {
  const m = obj(metadata) ?? {};
  const sample = obj(m.sample) ?? {};
  const geometry = obj(sample.geometry) ?? {};
  const contacts = obj(sample.contacts) ?? {};
  const measurement = obj(m.measurement) ?? {};
  const excitation = obj(measurement.excitation) ?? {};
  const detection = obj(measurement.detection) ?? {};
  const env = obj(m.environment) ?? {};
  const quantity = typeof measurement.quantity === 'string' && QUANTITIES.includes(measurement.quantity)
    ? quantityLabel(measurement.quantity as TransportDataset['measurement']['quantity'])
    : undefined;
  const slope = finite(detection.filterSlope);
  const count = finite(detection.averagingCount);
  return {
    description: text(m.description) ?? null,
    keywords: list(m.keywords).map(text).filter((k): k is string => Boolean(k)),
    license: licence(m.license),
    related: opts.hideRelated ? [] : list(m.relatedIdentifiers).flatMap((r) => {
      const [identifier, type, relation] = [text(obj(r)?.identifier), text(obj(r)?.identifierType), text(obj(r)?.relationType)];
      return identifier && type && relation ? [{ relation: relationWords(relation), identifier, href: relatedHref(type, identifier) }] : [];
    }),
    funding: list(m.funding).flatMap((f) => {
      const funder = text(obj(f)?.funderName);
      const award = [text(obj(f)?.awardNumber), text(obj(f)?.awardTitle)].filter(Boolean).join(' — ');
      return funder ? [{ funder, award: award || null }] : [];
    }),
    sampleName: text(sample.name) ?? null,
    sample: facts([
      ['Material', text(sample.material)], ['Formula', text(sample.formula)],
      ['Form', pick({}, sample.form)], ['Substrate', text(sample.substrate)],
    ]),
    geometry: facts([
      ['Voltage-contact spacing', amount(geometry.lengthBetweenVoltageContacts)], ['Width', amount(geometry.width)],
      ['Thickness', amount(geometry.thickness)], ['Diameter', amount(geometry.diameter)],
      ['Cross-section area', amount(geometry.crossSectionArea)],
    ]),
    contacts: facts([
      ['Configuration', pick(CONFIGURATION, contacts.configuration)], ['Contact material', text(contacts.contactMaterial)],
      ['Contact spacing', amount(contacts.spacing)],
    ]),
    measurement: facts([['Quantity', quantity], ['Wiring', pick(MODE, measurement.mode)]]),
    excitation: facts([
      ['Type', pick(EXCITATION, excitation.type)], ['Current', amount(excitation.currentAmplitude)], ['Frequency', amount(excitation.frequency)],
    ]),
    detection: facts([
      ['Instrument', pick(INSTRUMENT, detection.instrumentType)], ['Time constant', amount(detection.timeConstant)],
      ['Filter order', finite(detection.filterOrder)?.toString()], ['Filter slope', slope === undefined ? undefined : `${slope} dB/oct`],
      ['Averaging window', amount(detection.averagingWindow)],
      ['Readings averaged', count === undefined ? undefined : String(count)],
    ]),
    environment: facts([
      ['Temperature', range(env.temperatureRange)], ['Field', range(env.fieldRange)],
      ['Field orientation', pick(ORIENTATION, env.fieldOrientation)], ['Angle', amount(env.angle)],
      ['Swept', pick({}, env.sweepVariable)], ['Sweep rate', amount(env.sweepRate)], ['Sweep direction', pick({}, env.sweepDirection)],
    ]),
  };
}
