// What each axis of a curve measures, so curves from different labs line up by quantity rather than by column name.
import type { ColumnSummary } from '@/lib/transport/summary/types';
import type { CurveAxis, CurveOption, PreviewLike } from './types';

type QuantityText = { name: string; symbol: string; ascii: string };

// Names and the symbols of the trade (common practice) for the column quantities of the dataset schema.
const QUANTITIES: Readonly<Record<string, QuantityText>> = {
  temperature: { name: 'Temperature', symbol: 'T', ascii: 'temperature' },
  field: { name: 'Magnetic field', symbol: 'B', ascii: 'field' },
  resistance: { name: 'Resistance', symbol: 'R', ascii: 'resistance' },
  'hall-resistance': { name: 'Hall resistance', symbol: 'R_xy', ascii: 'hall resistance' },
  resistivity: { name: 'Resistivity', symbol: 'ρ', ascii: 'resistivity' },
  'hall-resistivity': { name: 'Hall resistivity', symbol: 'ρ_xy', ascii: 'hall resistivity' },
  'sheet-resistance': { name: 'Sheet resistance', symbol: 'R_s', ascii: 'sheet resistance' },
  magnetoresistance: { name: 'Magnetoresistance', symbol: 'MR', ascii: 'magnetoresistance' },
  conductance: { name: 'Conductance', symbol: 'G', ascii: 'conductance' },
  conductivity: { name: 'Conductivity', symbol: 'σ', ascii: 'conductivity' },
  voltage: { name: 'Voltage', symbol: 'V', ascii: 'voltage' },
  current: { name: 'Current', symbol: 'I', ascii: 'current' },
  'lock-in-x': { name: 'Lock-in in-phase signal', symbol: 'X', ascii: 'lock-in X' },
  'lock-in-y': { name: 'Lock-in quadrature signal', symbol: 'Y', ascii: 'lock-in Y' },
  'lock-in-r': { name: 'Lock-in magnitude', symbol: 'R_lock-in', ascii: 'lock-in R' },
  'lock-in-phase': { name: 'Lock-in phase', symbol: 'θ', ascii: 'lock-in phase' },
  frequency: { name: 'Frequency', symbol: 'f', ascii: 'frequency' },
  angle: { name: 'Angle', symbol: 'θ', ascii: 'angle' },
  time: { name: 'Time', symbol: 't', ascii: 'time' },
  'gate-voltage': { name: 'Gate voltage', symbol: 'V_g', ascii: 'gate voltage' },
  'thermometer-resistance': { name: 'Thermometer resistance', symbol: 'R_th', ascii: 'thermometer resistance' },
};

/** The quantity an axis of a stored preview measures: derived curves are named by quantity, columns by the summary. */
export function quantityOfAxis(p: PreviewLike, axis: 'x' | 'y', columns: readonly Pick<ColumnSummary, 'name' | 'quantity'>[]): string {
  const name = p[axis];
  if (axis === 'y' && p.derived && QUANTITIES[name]) return name;
  // Derived field curves are over |B| (named '|B|' after the x column 'B').
  const bare = /^\|(.+)\|$/.exec(name)?.[1] ?? name;
  return columns.find((c) => c.name === bare)?.quantity ?? 'other';
}

export function curveOption(p: PreviewLike, columns: readonly Pick<ColumnSummary, 'name' | 'quantity'>[]): CurveOption {
  return {
    x: { column: p.x, quantity: quantityOfAxis(p, 'x', columns), ucum: p.xUcum },
    y: { column: p.y, quantity: quantityOfAxis(p, 'y', columns), ucum: p.yUcum },
    derived: p.derived,
    sourcePoints: p.sourcePoints,
    points: p.points,
  };
}

/**
 * Two axes can share a plot axis when they measure the same quantity in the same (SI) unit. Values of a column whose
 * unit was not recognised are in an unknown unit, so they only match themselves.
 */
export function axisKey(axis: CurveAxis): string {
  return `${axis.quantity}|${axis.ucum ?? '?'}`;
}

export function parseAxisKey(key: string): { quantity: string; ucum: string | null } {
  const bar = key.lastIndexOf('|');
  const ucum = key.slice(bar + 1);
  return { quantity: key.slice(0, bar), ucum: ucum === '?' ? null : ucum };
}

/** Display text of a quantity: 'Resistivity', 'ρ', and an ASCII name for CSV headers. */
export function quantityText(quantity: string): QuantityText {
  return QUANTITIES[quantity] ?? { name: 'Other quantity', symbol: 'value', ascii: 'value' };
}

/** 'Resistivity ρ'; 'Other quantity' when the analysis could not tell; '(unit unknown)' when values are not in SI. */
export function axisTitle(key: string): string {
  const { quantity, ucum } = parseAxisKey(key);
  const t = quantityText(quantity);
  const symbol = QUANTITIES[quantity] ? ` ${t.symbol}` : '';
  return `${t.name}${symbol}${ucum === null ? ' (unit unknown)' : ''}`;
}
