import { fieldToTesla, ucumFromText, unitInfo, type Dimension } from '@/lib/transport/units';
import { quantityFromName } from './quantity-names';
import type { ColumnOverride, ParseWarningCode, TransportQuantity } from './types';

/** How one column's file values become SI: si = value · factor + offset (converted false: left as in the file). */
export type ColumnMapping = {
  quantity: TransportQuantity;
  ucum: string | null;
  siUcum: string | null;
  factor: number;
  offset: number;
  converted: boolean;
  confidence: number;
  reason: string;
  notes: { code: ParseWarningCode; message: string }[];
};

const DIMENSIONS_OF: Partial<Record<TransportQuantity, Dimension[]>> = {
  temperature: ['temperature'],
  field: ['magneticFluxDensity', 'magneticFieldStrength'],
  resistance: ['resistance'],
  'hall-resistance': ['resistance'],
  'thermometer-resistance': ['resistance'],
  'sheet-resistance': ['sheetResistance', 'resistance'],
  resistivity: ['resistivity'],
  'hall-resistivity': ['resistivity'],
  magnetoresistance: ['dimensionless'],
  conductance: ['conductance'],
  conductivity: ['conductivity'],
  voltage: ['voltage'],
  'gate-voltage': ['voltage'],
  'lock-in-x': ['voltage', 'current'],
  'lock-in-y': ['voltage', 'current'],
  'lock-in-r': ['voltage', 'current'],
  'lock-in-phase': ['angle'],
  angle: ['angle'],
  current: ['current'],
  frequency: ['frequency'],
  time: ['time'],
};

const QUANTITY_OF_DIMENSION: Partial<Record<Dimension, TransportQuantity>> = {
  temperature: 'temperature', magneticFluxDensity: 'field', magneticFieldStrength: 'field', resistance: 'resistance',
  sheetResistance: 'sheet-resistance', resistivity: 'resistivity', conductance: 'conductance', conductivity: 'conductivity',
  voltage: 'voltage', current: 'current', frequency: 'frequency', angle: 'angle', time: 'time',
};

// Units assumed when a header gives none (common practice); each use raises a 'unit-assumed' warning.
const ASSUMED_UNIT: Partial<Record<TransportQuantity, string>> = {
  temperature: 'K', field: 'T', resistance: 'Ohm', 'hall-resistance': 'Ohm', 'thermometer-resistance': 'Ohm',
  'sheet-resistance': 'Ohm/{sq}', voltage: 'V', 'gate-voltage': 'V', 'lock-in-x': 'V', 'lock-in-y': 'V', 'lock-in-r': 'V',
  'lock-in-phase': 'deg', angle: 'deg', current: 'A', frequency: 'Hz', time: 's',
};

export type MappingContext = { hasLockInPair: boolean };

function refineForLockIn(q: TransportQuantity, name: string, ctx: MappingContext): TransportQuantity {
  if (!ctx.hasLockInPair) return q;
  if (/^r$/i.test(name.trim())) return 'lock-in-r';
  if (q === 'angle' && /^(theta|θ|phi|φ|phase)$/i.test(name.trim())) return 'lock-in-phase';
  return q;
}

function siOf(ucum: string): { siUcum: string; factor: number; offset: number } | undefined {
  const info = unitInfo(ucum);
  if (!info) return undefined;
  // B and H differ in dimension; transport work reports both in tesla by the lab convention 1 Oe ↔ 1e-4 T.
  if (info.dimension === 'magneticFieldStrength' || info.dimension === 'magneticFluxDensity') {
    return { siUcum: 'T', factor: fieldToTesla(1, ucum), offset: 0 };
  }
  return { siUcum: info.siUcum, factor: info.factor, offset: info.offset };
}

function unconverted(quantity: TransportQuantity, ucum: string | null, confidence: number, reason: string, notes: ColumnMapping['notes']): ColumnMapping {
  return { quantity, ucum, siUcum: null, factor: 1, offset: 0, converted: false, confidence, reason, notes };
}

function withUnit(quantity: TransportQuantity, ucum: string, confidence: number, reason: string, notes: ColumnMapping['notes']): ColumnMapping {
  const si = siOf(ucum);
  if (!si) return unconverted(quantity, null, confidence * 0.5, reason, notes);
  const fieldNote = unitInfo(ucum)?.dimension === 'magneticFieldStrength' ? `; ${ucum} → T by the lab convention 1 Oe ↔ 1e-4 T (μ0H)` : '';
  return { quantity, ucum, siUcum: si.siUcum, factor: si.factor, offset: si.offset, converted: true, confidence, reason: reason + fieldNote, notes };
}

// A Symbol-font Ω arrives as 'W' in Latin-1 exports ("R (W)", "rho (mW cm)"): read it as ohm for resistive columns.
function symbolFontOhm(unitText: string, quantity: TransportQuantity | undefined): string | undefined {
  const resistive = quantity === 'resistance' || quantity === 'hall-resistance' || quantity === 'thermometer-resistance' ||
    quantity === 'sheet-resistance' || quantity === 'resistivity' || quantity === 'hall-resistivity';
  if (!resistive || !/^[µumkM]?W(\s*[·.*]?\s*(cm|m))?(\/sq)?$/.test(unitText.trim())) return undefined;
  return unitText.trim().replace('W', 'Ohm');
}

/** Quantity, UCUM unit and SI conversion of one column, from its name and unit text (or a metadata override). */
export function mapColumn(header: string, name: string, unitText: string | null, ctx: MappingContext, override?: ColumnOverride): ColumnMapping {
  const notes: ColumnMapping['notes'] = [];
  if (override?.quantity && override.unit) {
    const reason = `header '${header}': quantity ${override.quantity} and unit ${override.unit} from the dataset's column metadata`;
    if (!unitInfo(override.unit)) {
      notes.push({ code: 'unit-unknown', message: `Column '${name}': the metadata unit '${override.unit}' is not a UCUM code Ohmstead knows; values are left as in the file.` });
      return unconverted(override.quantity, null, 0.5, reason, notes);
    }
    return withUnit(override.quantity, override.unit, 1, reason, notes);
  }
  const byName = quantityFromName(name);
  const nameQuantity = override?.quantity ?? (byName ? refineForLockIn(byName.quantity, name, ctx) : undefined);
  const refined = byName && nameQuantity !== byName.quantity ? ` (with X and Y columns present → ${nameQuantity})` : '';
  const nameRule = override?.quantity ? `quantity ${override.quantity} from the dataset's column metadata` : byName ? byName.rule + refined : `name ${name || '(empty)'} not recognised`;
  const parts = [`header '${header}': ${nameRule}`];
  const nameConfidence = override?.quantity ? 1 : (byName?.confidence ?? 0);
  const text = override?.unit ?? unitText;
  if (text === null || text.trim() === '') {
    const assumed = nameQuantity ? ASSUMED_UNIT[nameQuantity] : undefined;
    if (!nameQuantity) return unconverted('other', null, 0.1, `${parts[0]}; no unit`, notes);
    if (!assumed) {
      notes.push({ code: 'unit-missing', message: `Column '${name}' (${nameQuantity}) has no unit in its header; values are left as in the file. Give the unit in the column metadata.` });
      return unconverted(nameQuantity, null, nameConfidence * 0.5, `${parts[0]}; no unit`, notes);
    }
    notes.push({ code: 'unit-assumed', message: `Column '${name}' has no unit in its header; assumed ${assumed} for ${nameQuantity}. Check it, or give the unit in the column metadata.` });
    return withUnit(nameQuantity, assumed, nameConfidence * 0.55, `${parts[0]}; no unit, assumed ${assumed}`, notes);
  }
  const symbolOhm = symbolFontOhm(text, nameQuantity);
  const hintDimension = nameQuantity ? DIMENSIONS_OF[nameQuantity]?.[0] : undefined;
  const read = ucumFromText(symbolOhm ?? text, hintDimension ? { dimension: hintDimension } : undefined);
  if (!read) {
    notes.push({ code: 'unit-unknown', message: `Column '${name}': unit '${text}' is not recognised; values are left as in the file and marked unconverted.` });
    return unconverted(nameQuantity ?? 'other', null, nameConfidence * 0.5, `${parts[0]}; unit '${text}' not recognised`, notes);
  }
  if (symbolOhm) notes.push({ code: 'unit-symbol-font', message: `Column '${name}': unit '${text}' read as ${read.ucum} (a Symbol-font Ω shows as 'W'). Check it.` });
  if (read.ambiguous) notes.push({ code: 'unit-ambiguous', message: `Column '${name}': ${read.reason}.` });
  let ucum = read.ucum;
  const dimension = unitInfo(ucum)?.dimension;
  parts.push(`unit ${describeUnitSource(header, text)} ${text} → UCUM ${ucum}`);
  let quantity = nameQuantity;
  let confidence = nameQuantity ? Math.min(1, nameConfidence + 0.05) : 0.6;
  if (quantity === 'sheet-resistance' && dimension === 'resistance') {
    ucum = `${ucum}/{sq}`; // Rs is written in plain Ω in many files; Ω/sq is the same number.
    parts.push(`read as ${ucum} for a sheet resistance`);
  } else if (dimension && (!quantity || !(DIMENSIONS_OF[quantity] ?? []).includes(dimension))) {
    const fromUnit = dimension === 'dimensionless' && quantity === undefined ? undefined : QUANTITY_OF_DIMENSION[dimension];
    if (quantity) {
      notes.push({ code: 'unit-conflict', message: `Column '${name}': the name suggests ${quantity} but the unit ${ucum} is ${dimension}; the unit was followed.` });
      confidence = 0.5;
    }
    quantity = fromUnit ? refineForLockIn(fromUnit, name, ctx) : 'other';
    parts.push(`unit decides → ${quantity}`);
  }
  return withUnit(quantity ?? 'other', ucum, confidence, parts.join('; '), notes);
}

function describeUnitSource(header: string, unitText: string): string {
  if (header.includes(`[${unitText}]`)) return 'in brackets';
  if (header.includes(`(${unitText})`)) return 'in parentheses';
  if (header.includes(`/${unitText}`)) return 'after /';
  if (header.includes(`_${unitText}`)) return 'after _';
  return header.includes(unitText) ? 'in header' : 'from units row';
}
