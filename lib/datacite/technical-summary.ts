import type { Detection, Environment, Excitation, Sample, TransportDataset } from '@/lib/schema';
import { labelFromUcum } from '@/lib/transport/units/label';

// Plain-language summary of how a dataset was measured, for DataCite TechnicalInfo and schema.org measurementTechnique.

const QUANTITY: Record<TransportDataset['measurement']['quantity'], string> = {
  resistance: 'resistance',
  resistivity: 'resistivity',
  'sheet-resistance': 'sheet resistance',
  'hall-resistance': 'Hall resistance',
  magnetoresistance: 'magnetoresistance',
  conductance: 'conductance',
  voltage: 'voltage',
  'current-voltage': 'current–voltage characteristic',
  other: 'other quantity',
};
const CONFIGURATION = { 'four-wire-linear': 'four-wire linear', 'van-der-pauw': 'van der Pauw', 'hall-bar': 'Hall bar', 'two-wire': 'two-wire' };
const EXCITATION: Record<Excitation['type'], string> = { dc: 'DC', 'dc-reversal': 'DC with current reversal', ac: 'AC' };
const INSTRUMENT = { 'dc-voltmeter': 'DC voltmeter', 'analog-lock-in': 'analogue lock-in amplifier', 'digital-lock-in': 'digital lock-in amplifier' };

/** Human label of the measured quantity, e.g. "sheet resistance". */
export function quantityLabel(quantity: TransportDataset['measurement']['quantity']): string {
  return QUANTITY[quantity];
}

// SI Brochure §5.4.3: a space between number and unit, except for the plane-angle degree sign.
const withUnit = (text: string, unit: string) => (labelFromUcum(unit) === '°' ? `${text}°` : `${text} ${labelFromUcum(unit)}`);
const amount = (q: { value: number; unit: string }) => withUnit(String(q.value), q.unit);
const SWEEP_DIRECTION = { up: 'upward', down: 'downward', both: 'in both directions' };
const words = (token: string) => token.replace(/-/g, ' ');
const joined = (parts: (string | false | undefined)[]) => parts.filter((p): p is string => Boolean(p)).join(', ');

function sampleLine(sample: Sample): string {
  const material = sample.material && sample.formula ? `${sample.material} (${sample.formula})` : (sample.material ?? sample.formula);
  return `Sample: ${joined([sample.name, material, sample.form && words(sample.form), sample.substrate && `on ${sample.substrate}`])}.`;
}

function geometryLine(sample: Sample): string | undefined {
  const g = sample.geometry;
  if (!g) return undefined;
  const parts = joined([
    g.lengthBetweenVoltageContacts && `voltage-contact spacing ${amount(g.lengthBetweenVoltageContacts)}`,
    g.width && `width ${amount(g.width)}`,
    g.thickness && `thickness ${amount(g.thickness)}`,
    g.diameter && `diameter ${amount(g.diameter)}`,
    g.crossSectionArea && `cross-section ${amount(g.crossSectionArea)}`,
  ]);
  return parts ? `Geometry: ${parts}.` : undefined;
}

function contactsLine(sample: Sample): string | undefined {
  const c = sample.contacts;
  if (!c) return undefined;
  const parts = joined([
    c.configuration && CONFIGURATION[c.configuration],
    c.contactMaterial,
    c.spacing && `spacing ${amount(c.spacing)}`,
  ]);
  return parts ? `Contacts: ${parts}.` : undefined;
}

function excitationText(e: Excitation): string {
  const current = e.currentAmplitude ? ` ${amount(e.currentAmplitude)}` : '';
  const frequency = e.frequency ? ` at ${amount(e.frequency)}` : '';
  return `${EXCITATION[e.type]}${current}${frequency}`;
}

function detectionText(d: Detection): string {
  return joined([
    d.instrumentType && INSTRUMENT[d.instrumentType],
    d.timeConstant && `time constant ${amount(d.timeConstant)}`,
    d.filterOrder !== undefined && `${d.filterOrder}-stage low-pass filter`,
    d.filterSlope !== undefined && `${d.filterSlope} dB/oct`,
    d.averagingWindow && `averaging window ${amount(d.averagingWindow)}`,
    d.averagingCount !== undefined && `${d.averagingCount} reading${d.averagingCount === 1 ? '' : 's'} averaged`,
  ]);
}

function environmentLine(env: Environment | undefined): string | undefined {
  if (!env) return undefined;
  const range = (r: { min: number; max: number; unit: string }) => withUnit(`${r.min} to ${r.max}`, r.unit);
  const sweep =
    env.sweepVariable &&
    [`${words(env.sweepVariable)} swept`, env.sweepDirection && SWEEP_DIRECTION[env.sweepDirection], env.sweepRate && `at ${amount(env.sweepRate)}`]
      .filter(Boolean)
      .join(' ');
  const parts = joined([
    env.temperatureRange && `temperature ${range(env.temperatureRange)}`,
    env.fieldRange && `field ${range(env.fieldRange)}${env.fieldOrientation ? ` (${words(env.fieldOrientation)})` : ''}`,
    env.angle && `angle ${amount(env.angle)}`,
    sweep,
  ]);
  return parts ? `Conditions: ${parts}.` : undefined;
}

/** Multi-line summary of sample, geometry, contacts, excitation, detection, conditions and columns. */
export function describeTechnicalInfo(record: TransportDataset): string {
  const m = record.measurement;
  const lines = [
    sampleLine(record.sample),
    geometryLine(record.sample),
    contactsLine(record.sample),
    `Measurement: ${joined([QUANTITY[m.quantity], m.mode])}.`,
    m.excitation && `Excitation: ${excitationText(m.excitation)}.`,
    m.detection && detectionText(m.detection) && `Detection: ${detectionText(m.detection)}.`,
    environmentLine(record.environment),
    record.columns?.length &&
      `Columns: ${record.columns.map((c) => `${c.name} (${words(c.quantity)}, ${labelFromUcum(c.unit)})`).join(', ')}.`,
  ];
  return lines.filter((l): l is string => typeof l === 'string' && l !== '').join('\n');
}

/** One phrase for schema.org measurementTechnique, e.g. "Four-wire resistance measurement; AC 1 mA at 13.7 Hz excitation; …". */
export function describeMeasurementTechnique(record: TransportDataset): string {
  const m = record.measurement;
  const head = `${m.mode ? `${m.mode} ` : ''}${QUANTITY[m.quantity]} measurement`;
  const parts = [
    head.charAt(0).toUpperCase() + head.slice(1),
    record.sample.contacts?.configuration && `${CONFIGURATION[record.sample.contacts.configuration]} contacts`,
    m.excitation && `${excitationText(m.excitation)} excitation`,
    m.detection?.instrumentType && `${INSTRUMENT[m.detection.instrumentType]} detection`,
  ];
  return parts.filter((p): p is string => Boolean(p)).join('; ');
}
