import type { TransportDatasetDraft } from '@/lib/schema';
import type { ParsedTable } from '@/lib/transport/parse';
import { assessMeasurement } from '@/lib/transport/quality';
import { measurementContext } from './context';
import { collectedM4, type Derivation } from './derivation';
import { deriveHall, deriveMagnetoresistance } from './derive-field';
import { deriveNoise } from './derive-noise';
import { deriveResistivity } from './derive-resistivity';
import { deriveRrr } from './derive-rrr';
import { geometryFromMetadata, siOf } from './geometry';
import { downsampleCurve } from './preview';
import { assignRoles } from './roles';
import { SUMMARY_VERSION, type ColumnSummary, type CurvePreview, type FileSummary } from './types';

export type SummariseTableOptions = { fileName?: string; previewPoints?: number };

function excitationCurrentA(metadata: TransportDatasetDraft | undefined, table: ParsedTable): number | null {
  const fromMeta = siOf(metadata?.measurement?.excitation?.currentAmplitude);
  if (fromMeta) return fromMeta;
  // A current column that holds one value (within 1 %) is the excitation; a swept current is not.
  const col = table.columns.find((c) => c.quantity === 'current' && c.converted && c.range);
  if (col?.range && col.range.max > 0 && (col.range.max - col.range.min) <= 0.01 * Math.abs(col.range.max)) return (col.range.max + col.range.min) / 2;
  return null;
}

/** Summary of an already parsed table (the browser preview path uses the first rows; summariseFile the whole file). */
export function summariseTable(table: ParsedTable, metadata?: TransportDatasetDraft, options: SummariseTableOptions = {}): FileSummary {
  const { roles, xIndex, sweep } = assignRoles(table.columns, metadata);
  const geometry = geometryFromMetadata(metadata);
  const currentA = excitationCurrentA(metadata, table);
  const x = xIndex !== null ? table.columns[xIndex] : null;
  const d: Derivation = {
    columns: table.columns, x, sweep, geometry, metadata, currentA,
    derived: [], notComputed: [], curves: [],
    context: measurementContext(metadata, table.columns, sweep, geometry, currentA),
    previewPoints: options.previewPoints ?? 500,
    m4: [],
  };
  if (table.rowCount > 0) {
    deriveResistivity(d);
    deriveRrr(d);
    const field = table.columns.find((c) => c.quantity === 'field' && c.converted && c.range);
    if (field && sweep.variable === 'field') {
      deriveMagnetoresistance(d, field);
      deriveHall(d, field);
    }
    const mainY = table.columns.find((c, i) => roles[i] === 'y' && c.converted && c.range);
    if (mainY) deriveNoise(d, mainY);
  }
  const rho = d.curves.find((c) => c.name === 'resistivity');
  if (rho && !d.context.resistivityOhmM) {
    let min = Infinity;
    let max = -Infinity;
    for (const v of rho.y) if (Number.isFinite(v)) [min, max] = [Math.min(min, v), Math.max(max, v)];
    if (min <= max) d.context.resistivityOhmM = { min, max };
  }
  const density = d.derived.find((v) => v.key === 'hall.density');
  if (density) d.context.carrierDensityPerM3 = density.value * 1e6;
  const mobility = d.derived.find((v) => v.key === 'hall.mobility');
  if (mobility) d.context.mobilityM2PerVs = mobility.value * 1e-4;

  const target = options.previewPoints ?? 500;
  const previews: CurvePreview[] = [];
  if (x) {
    table.columns.forEach((c, i) => {
      if (roles[i] !== 'y') return;
      const { points, sourcePoints } = downsampleCurve(x.values, c.values, target, collectedM4(d, x.values, c.values));
      previews.push({ x: x.name, y: c.name, xUcum: x.siUcum ?? x.ucum, yUcum: c.siUcum ?? c.ucum, sourcePoints, points, derived: false });
    });
    for (const curve of d.curves) {
      const { points, sourcePoints } = downsampleCurve(curve.x, curve.y, target);
      const xName = curve.x === x.values ? x.name : `|${x.name}|`;
      previews.push({ x: xName, y: curve.name, xUcum: x.siUcum ?? x.ucum, yUcum: curve.ucum, sourcePoints, points, derived: true });
    }
  }
  const columns: ColumnSummary[] = table.columns.map((c, i) => ({
    index: c.index, name: c.name, rawHeader: c.rawHeader, quantity: c.quantity, role: roles[i], ucum: c.ucum, siUcum: c.siUcum,
    converted: c.converted, confidence: c.confidence, reason: c.reason, range: c.range, nanCount: c.nanCount,
  }));
  return {
    summaryVersion: SUMMARY_VERSION,
    fileName: options.fileName ?? null,
    bytes: table.bytesRead,
    encoding: table.encoding,
    delimiter: table.delimiter,
    decimalSeparator: table.decimalSeparator,
    rowCount: table.rowCount,
    truncated: table.truncated,
    headerMetadata: table.headerMetadata,
    columns,
    sweep,
    geometry,
    derived: d.derived,
    notComputed: d.notComputed,
    quality: assessMeasurement(d.context),
    previews,
    warnings: table.warnings,
  };
}
