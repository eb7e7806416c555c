// Maps a published version (its record and its files' analyses) to what the search index holds. Pure.
import type { TransportDatasetDraft } from '@/lib/schema';
import { convertValue, fieldToTesla, toSi } from '@/lib/transport/units';
import type { FileSummary } from '@/lib/transport/summary/types';
import type { NumericRange, SearchDoc } from './types';

export type PublishedVersionSource = {
  versionId: string;
  datasetId: string;
  versionNumber: number;
  isLatest: boolean;
  title: string;
  record: TransportDatasetDraft;
  group: { slug: string; name: string };
  publishedAt: Date;
  embargoUntil: string | null;
  doi: string | null;
  summaries: FileSummary[];
};

/** Derived values (by key prefix) that make a quantity findable. */
const DERIVED_QUANTITY: Record<string, string> = {
  resistivity: 'resistivity', 'sheet-resistance': 'sheet-resistance', magnetoresistance: 'magnetoresistance', hall: 'hall-effect', rrr: 'rrr',
};

const METHOD_OF_CONFIGURATION: Record<string, string> = {
  'four-wire-linear': 'four-wire', 'van-der-pauw': 'van-der-pauw', 'hall-bar': 'hall-bar', 'two-wire': 'two-wire',
};

/** Markdown to plain searchable text (links keep their words, markup goes). */
export function plainText(markdown: string): string {
  return markdown.replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1').replace(/[*_`>#|~]+/g, ' ').replace(/\s+/g, ' ').trim();
}

function union(a: NumericRange | undefined, b: NumericRange | undefined): NumericRange | undefined {
  if (!a) return b;
  if (!b) return a;
  return [Math.min(a[0], b[0]), Math.max(a[1], b[1])];
}

function finiteRange(min: number, max: number): NumericRange | undefined {
  return Number.isFinite(min) && Number.isFinite(max) ? [Math.min(min, max), Math.max(min, max)] : undefined;
}

/** Ranges from the measured columns (SI), falling back to what the record states. */
function rangesOf(record: TransportDatasetDraft, summaries: FileSummary[]): SearchDoc['ranges'] {
  let temperatureK: NumericRange | undefined;
  let fieldT: NumericRange | undefined;
  for (const s of summaries) {
    for (const c of s.columns) {
      if (!c.range || !c.converted) continue;
      if (c.quantity === 'temperature' && c.siUcum === 'K') temperatureK = union(temperatureK, [c.range.min, c.range.max]);
      if (c.quantity === 'field' && c.siUcum === 'T') fieldT = union(fieldT, [c.range.min, c.range.max]);
    }
  }
  const env = record.environment;
  const tr = env?.temperatureRange;
  if (!temperatureK && tr?.unit && typeof tr.min === 'number' && typeof tr.max === 'number') {
    temperatureK = finiteRange(convertValue(tr.min, tr.unit, 'K'), convertValue(tr.max, tr.unit, 'K'));
  }
  const fr = env?.fieldRange;
  if (!fieldT && fr?.unit && typeof fr.min === 'number' && typeof fr.max === 'number') {
    fieldT = finiteRange(fieldToTesla(fr.min, fr.unit), fieldToTesla(fr.max, fr.unit));
  }
  const freq = record.measurement?.excitation?.frequency;
  const frequencyHz = freq?.unit && typeof freq.value === 'number' ? toSi(freq.value, freq.unit) : undefined;
  const t = record.sample?.geometry?.thickness;
  const thicknessM = t?.unit && typeof t.value === 'number' ? toSi(t.value, t.unit) : undefined;
  return {
    ...(temperatureK && { temperatureK }),
    ...(fieldT && { fieldT }),
    ...(frequencyHz !== undefined && Number.isFinite(frequencyHz) && { frequencyHz: [frequencyHz, frequencyHz] as NumericRange }),
    ...(thicknessM !== undefined && Number.isFinite(thicknessM) && { thicknessM: [thicknessM, thicknessM] as NumericRange }),
  };
}

/** The first measured (not computed) preview: the card's sparkline, with its temperature span when x is T. */
function mainCurve(summaries: FileSummary[]): Pick<SearchDoc, 'sparkline' | 'temperatureSpanK'> {
  for (const s of summaries) {
    const p = s.previews.find((c) => !c.derived && c.points.length > 1) ?? s.previews[0];
    if (!p || p.points.length < 2) continue;
    const step = Math.max(1, Math.ceil(p.points.length / 64));
    const sparkline = p.points.filter((_, i) => i % step === 0).slice(0, 64);
    const xs = p.points.map(([x]) => x).filter((x) => x > 0);
    const span = p.xUcum === 'K' && xs.length ? finiteRange(Math.min(...xs), Math.max(...xs)) : undefined;
    return { sparkline, ...(span && { temperatureSpanK: span }) };
  }
  return {};
}

function quantitiesOf(record: TransportDatasetDraft, summaries: FileSummary[]): string[] {
  const out = new Set<string>();
  if (record.measurement?.quantity && record.measurement.quantity !== 'other') out.add(record.measurement.quantity);
  for (const s of summaries) {
    for (const d of s.derived) {
      const name = DERIVED_QUANTITY[d.key.split('.')[0]];
      if (name) out.add(name);
    }
  }
  return [...out];
}

export function buildSearchDoc(src: PublishedVersionSource, now: Date = new Date()): SearchDoc {
  const r = src.record;
  const methods = new Set<string>();
  if (r.measurement?.mode) methods.add(r.measurement.mode);
  const configuration = r.sample?.contacts?.configuration;
  if (configuration) methods.add(METHOD_OF_CONFIGURATION[configuration] ?? configuration);
  const embargoed = src.embargoUntil !== null && now.getTime() < Date.parse(`${src.embargoUntil}T00:00:00Z`);
  return {
    versionId: src.versionId,
    datasetId: src.datasetId,
    versionNumber: src.versionNumber,
    isLatest: src.isLatest,
    title: src.title,
    description: plainText(r.description ?? ''),
    keywords: (r.keywords ?? []).filter((k): k is string => typeof k === 'string'),
    material: r.sample?.material ?? r.sample?.name ?? '',
    formula: r.sample?.formula ?? '',
    creators: (r.creators ?? []).map((c) => c?.name).filter((n): n is string => typeof n === 'string'),
    group: src.group,
    quantities: quantitiesOf(r, src.summaries),
    methods: [...methods],
    excitation: r.measurement?.excitation?.type ?? null,
    year: src.publishedAt.getUTCFullYear(),
    publishedAt: src.publishedAt.toISOString(),
    embargoed,
    doi: src.doi,
    // Curves of an embargoed version are not public: the card shows the lock instead of a sparkline.
    ranges: rangesOf(r, src.summaries),
    ...(embargoed ? {} : mainCurve(src.summaries)),
  };
}
