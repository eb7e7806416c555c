import type { TransportDatasetDraft } from '@/lib/schema';
import type { ColumnRole, ParsedColumn, TransportQuantity } from '@/lib/transport/parse';
import type { SweepInfo } from './types';

// Quantities that are the measured response (plotted as y) rather than the swept or recorded conditions.
const RESPONSE: ReadonlySet<TransportQuantity> = new Set<TransportQuantity>([
  'resistance', 'hall-resistance', 'sheet-resistance', 'resistivity', 'hall-resistivity', 'magnetoresistance',
  'conductance', 'conductivity', 'voltage', 'lock-in-x', 'lock-in-y', 'lock-in-r',
]);

const SWEEP_QUANTITY: Record<NonNullable<SweepInfo['variable']>, TransportQuantity> = {
  temperature: 'temperature', field: 'field', angle: 'angle', current: 'current', time: 'time', 'gate-voltage': 'gate-voltage', other: 'other',
};

const span = (c: ParsedColumn | undefined) => (c?.range ? c.range.max - c.range.min : 0);
const relativeSpan = (c: ParsedColumn | undefined) =>
  c?.range ? span(c) / Math.max(Math.abs(c.range.max), Math.abs(c.range.min), 1e-300) : 0;

function sweptFromData(columns: ParsedColumn[]): SweepInfo['variable'] {
  const by = (q: TransportQuantity) => columns.find((c) => c.quantity === q && c.converted);
  const temperature = by('temperature');
  const field = by('field');
  // A field sweep at (nearly) fixed temperature, or a temperature sweep: the larger relative change wins.
  if (field && span(field) >= 0.01 && (!temperature || relativeSpan(temperature) < 0.05)) return 'field';
  if (temperature && relativeSpan(temperature) >= 0.05) return 'temperature';
  if (field && span(field) >= 0.01) return 'field';
  for (const q of ['angle', 'gate-voltage', 'current', 'time'] as const) if (by(q) && span(by(q)) > 0) return q;
  return null;
}

export type RoleAssignment = { roles: ColumnRole[]; xIndex: number | null; sweep: SweepInfo };

/** x, y and aux roles: metadata first, then the swept variable (metadata, else the data) as x, responses as y. */
export function assignRoles(columns: ParsedColumn[], metadata: TransportDatasetDraft | undefined): RoleAssignment {
  const declared = new Map((metadata?.columns ?? []).filter((c) => c.name && c.role).map((c) => [c.name as string, c.role as ColumnRole]));
  const metaSweep = metadata?.environment?.sweepVariable;
  const sweep: SweepInfo = metaSweep ? { variable: metaSweep, from: 'metadata' } : { variable: sweptFromData(columns), from: 'data' };
  if (!sweep.variable) sweep.from = 'none';
  let xIndex = columns.findIndex((c) => declared.get(c.name) === 'x');
  if (xIndex < 0 && sweep.variable) xIndex = columns.findIndex((c) => c.quantity === SWEEP_QUANTITY[sweep.variable as keyof typeof SWEEP_QUANTITY]);
  if (xIndex < 0) xIndex = columns.findIndex((c) => !RESPONSE.has(c.quantity));
  const roles = columns.map((c, i): ColumnRole => {
    const d = declared.get(c.name);
    if (d) return d;
    if (i === xIndex) return 'x';
    return RESPONSE.has(c.quantity) ? 'y' : 'aux';
  });
  return { roles, xIndex: xIndex >= 0 ? xIndex : null, sweep };
}
