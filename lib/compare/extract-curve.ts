// One curve of a parsed table at full resolution, named as the file summary names its previews: a measured column
// against the x column, or a curve lib/transport derives (ρ, R_s, MR). Pure: runs on the server and in the browser.
import type { TransportDatasetDraft } from '@/lib/schema';
import type { ColumnOverride, ParsedTable } from '@/lib/transport/parse';
import { measurementContext } from '@/lib/transport/summary/context';
import type { Derivation } from '@/lib/transport/summary/derivation';
import { deriveMagnetoresistance } from '@/lib/transport/summary/derive-field';
import { deriveResistivity } from '@/lib/transport/summary/derive-resistivity';
import { geometryFromMetadata, siOf } from '@/lib/transport/summary/geometry';
import { assignRoles } from '@/lib/transport/summary/roles';

export type FullCurve = { x: Float64Array; y: Float64Array; xUcum: string | null; yUcum: string | null };

/** The record's column mapping as parser overrides (the same rule as summariseFile, so names and units agree). */
export function columnOverrides(metadata: TransportDatasetDraft | undefined): ColumnOverride[] {
  return (metadata?.columns ?? [])
    .filter((c): c is typeof c & { name: string } => typeof c.name === 'string' && c.name !== '')
    .map((c) => ({ name: c.name, quantity: c.quantity, unit: c.unit, role: c.role }));
}

// The excitation current as summariseTable finds it: the record's amplitude, else a current column that holds one
// value within 1 % (a swept current is not an excitation).
function excitationCurrentA(metadata: TransportDatasetDraft | undefined, table: ParsedTable): number | null {
  const fromMeta = siOf(metadata?.measurement?.excitation?.currentAmplitude);
  if (fromMeta) return fromMeta;
  const col = table.columns.find((c) => c.quantity === 'current' && c.converted && c.range);
  if (col?.range && col.range.max > 0 && col.range.max - col.range.min <= 0.01 * Math.abs(col.range.max)) return (col.range.max + col.range.min) / 2;
  return null;
}

function finite(x: Float64Array, y: Float64Array): { x: Float64Array; y: Float64Array } {
  let n = 0;
  for (let i = 0; i < x.length; i++) if (Number.isFinite(x[i]) && Number.isFinite(y[i])) n++;
  if (n === x.length) return { x, y };
  const ox = new Float64Array(n);
  const oy = new Float64Array(n);
  for (let i = 0, k = 0; i < x.length; i++) {
    if (Number.isFinite(x[i]) && Number.isFinite(y[i])) [ox[k], oy[k], k] = [x[i], y[i], k + 1];
  }
  return { x: ox, y: oy };
}

/** The (x, y) curve of a preview of this table, finite pairs in file order, in SI; null when the table has no such curve. */
export function extractCurve(table: ParsedTable, metadata: TransportDatasetDraft | undefined, xName: string, yName: string): FullCurve | null {
  const { xIndex, sweep } = assignRoles(table.columns, metadata);
  const x = xIndex !== null ? table.columns[xIndex] : null;
  if (!x) return null;
  const unitOf = (c: { siUcum: string | null; ucum: string | null }) => c.siUcum ?? c.ucum;
  const column = table.columns.find((c) => c.name === yName);
  if (xName === x.name && column) return { ...finite(x.values, column.values), xUcum: unitOf(x), yUcum: unitOf(column) };
  // A derived curve: run the same derivation steps as summariseTable, then take the curve by name.
  const geometry = geometryFromMetadata(metadata);
  const currentA = excitationCurrentA(metadata, table);
  const d: Derivation = {
    columns: table.columns, x, sweep, geometry, metadata, currentA, derived: [], notComputed: [], curves: [],
    context: measurementContext(metadata, table.columns, sweep, geometry, currentA),
  };
  deriveResistivity(d);
  const field = table.columns.find((c) => c.quantity === 'field' && c.converted && c.range);
  if (yName === 'magnetoresistance' && field && sweep.variable === 'field') deriveMagnetoresistance(d, field);
  const curve = d.curves.find((c) => c.name === yName);
  if (!curve) return null;
  const expectedX = curve.x === x.values ? x.name : `|${x.name}|`;
  if (expectedX !== xName) return null;
  return { ...finite(curve.x, curve.y), xUcum: unitOf(x), yUcum: curve.ucum };
}
