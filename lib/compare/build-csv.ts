// The compare export as CSV in long ("tidy") form: one row per point, `curve, x (unit), y (unit)`, after a block of
// '#' lines citing every source (title, version, DOI, group) and stating the units and normalisation. Long form
// keeps every curve at full resolution without inventing a shared x grid (no interpolation, nothing lost).
import { citationParts } from './legend-text';
import { optionFor, missingReason } from './choose-axes';
import { referenceValue } from './normalise';
import { overlayAxes, scaleCurve, type OverlaySettings } from './prepare-overlay';
import { parseAxisKey, quantityText } from './quantities';
import type { CompareEntry } from './types';
import { findUnit, OERSTED_CONVENTION_NOTE, unitOptions } from './units';

/** Full-resolution values (SI) of the curve an entry shows, keyed by entry key. */
export type FullCurves = ReadonlyMap<string, { x: ArrayLike<number>; y: ArrayLike<number> }>;

export type CsvInput = { entries: readonly CompareEntry[]; settings: OverlaySettings; full: FullCurves; exportedAt: string; siteUrl: string };

/** Ten significant digits: more than any transport instrument resolves, and no binary noise (1.7000000000000002). */
export function csvNumber(v: number): string {
  return String(Number(v.toPrecision(10)));
}

const oneLine = (text: string) => text.replace(/[\r\n]+/g, ' ').trim();

function yHeader(settings: OverlaySettings, xAscii: string, yAscii: string, yUnitCode: string, xUnitCode: string, xFactor: number): string {
  const n = settings.normalisation;
  switch (n.kind) {
    case 'none': return `${yAscii} (${yUnitCode})`;
    case 'at-x': return `${yAscii} / ${yAscii} at ${xAscii} = ${csvNumber(n.x / xFactor)} ${xUnitCode} (1)`;
    case 'zero-field': return `${yAscii} / ${yAscii} at ${xAscii} = 0 (1)`;
    case 'max': return `${yAscii} / max |${yAscii}| (1)`;
  }
}

export function buildCompareCsv(input: CsvInput): string {
  const { settings: s } = input;
  const axes = overlayAxes(s);
  const xq = parseAxisKey(s.xKey);
  const yq = parseAxisKey(s.yKey);
  const xAscii = quantityText(xq.quantity).ascii;
  const yAscii = quantityText(yq.quantity).ascii;
  const yPlainUnit = findUnit(yq.ucum, s.yUnit) ?? unitOptions(yq.ucum)[0];
  const normalised = s.normalisation.kind !== 'none';
  const head: string[] = [
    '# Ohmstead compare export',
    `# Exported: ${input.exportedAt} from ${input.siteUrl}`,
    '# Layout: one row per measured point; "curve" is the number of a source listed below. Every finite point of each curve is included (no downsampling, no interpolation).',
    `# x: ${axes.xName} ${axes.xSymbol} in ${axes.xUnit.label || '1'} (UCUM ${axes.xUnit.ucum}), converted from each file's own unit through SI.`,
    normalised
      ? `# y: ${axes.yName}: ${axes.ySymbol}, a ratio (1); each curve is divided by its own reference value, computed from its full-resolution data.`
      : `# y: ${axes.yName} ${axes.ySymbol} in ${axes.yUnit.label || '1'} (UCUM ${axes.yUnit.ucum}), converted from each file's own unit through SI.`,
  ];
  if (xq.quantity === 'field' || axes.xUnit.convention) head.push(`# Field: values recorded in Oe were converted on deposit; ${OERSTED_CONVENTION_NOTE}`);
  head.push('# Sources (cite each dataset version you use by its DOI):');
  const rows: string[] = [];
  const leftOut: string[] = [];
  input.entries.forEach((entry, i) => {
    const number = i + 1;
    const cite = citationParts(entry).map(oneLine).join(' — ');
    const option = optionFor(entry, s.xKey, s.yKey);
    const data = input.full.get(entry.key);
    if (!option || !data) {
      leftOut.push(`# Left out: curve ${number} (${cite}): ${option ? 'its full-resolution data could not be read.' : missingReason(entry, s.xKey, s.yKey)}`);
      return;
    }
    const ref = referenceValue(data.x, data.y, s.normalisation, { xUnit: axes.xUnit, xSymbol: axes.xSymbol });
    if (!ref.ok) {
      leftOut.push(`# Left out: curve ${number} (${cite}): ${ref.reason}`);
      return;
    }
    const scaled = scaleCurve(data.x, data.y, ref.value, axes, { x: false, y: false });
    const columns = `columns ${oneLine(option.x.column)} and ${oneLine(option.y.column)}${option.derived ? ' (computed by Ohmstead from the file and its sample geometry)' : ''}`;
    const reference = normalised ? ` — reference ${csvNumber(ref.value / yPlainUnit.factor)} ${yPlainUnit.ucum}${ref.note ? ` (${ref.note})` : ''}` : '';
    head.push(`# curve ${number}: ${cite} — ${columns} — ${scaled.x.length} points${reference}`);
    for (let k = 0; k < scaled.x.length; k++) rows.push(`${number},${csvNumber(scaled.x[k])},${csvNumber(scaled.y[k])}`);
  });
  const header = `curve,${xAscii} (${axes.xUnit.ucum}),${yHeader(s, xAscii, yAscii, axes.yUnit.ucum, axes.xUnit.ucum, axes.xUnit.factor)}`;
  return [...head, ...leftOut, header, ...rows].join('\n') + '\n';
}
