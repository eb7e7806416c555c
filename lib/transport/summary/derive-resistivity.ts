import { resistivityFromCrossSection, resistivityFromSheetResistance, sheetResistanceFromBar, sheetResistanceFromResistivity, solveVanDerPauw } from '@/lib/transport/physics';
import { fieldEvenCurve, valueAtZeroField } from './field-curves';
import { binned as binnedPairs, curveOf, firstColumn, round, type Derivation } from './derivation';

const scaled = (values: Float64Array, k: number) => values.map((v) => v * k);

/** The file's resistance curve: an R column, else V (or lock-in X) divided by the excitation current. */
export function resistanceCurve(d: Derivation): Float64Array | null {
  const r = firstColumn(d, 'resistance');
  if (r) return r.values;
  const v = firstColumn(d, 'voltage') ?? firstColumn(d, 'lock-in-x') ?? firstColumn(d, 'lock-in-r');
  if (v && v.siUcum === 'V' && d.currentA && d.currentA > 0) return scaled(v.values, 1 / d.currentA); // Ohm's law R = V/I
  return null;
}

function vanDerPauwSheet(d: Derivation): Float64Array | null {
  const rs = d.columns.filter((c) => c.quantity === 'resistance' && c.converted);
  if (rs.length < 2) return null;
  const [a, b] = rs;
  const out = new Float64Array(a.values.length);
  for (let i = 0; i < out.length; i++) {
    const ra = a.values[i];
    const rb = b.values[i];
    out[i] = ra > 0 && rb > 0 ? solveVanDerPauw(ra, rb) : NaN; // van der Pauw (1958)
  }
  return out;
}

/** Adds the ρ and R_s curves the file and geometry allow, with notes on what is missing. */
export function deriveResistivity(d: Derivation): void {
  const n = d.columns[0]?.values.length ?? 0;
  const g = d.geometry;
  const rho = firstColumn(d, 'resistivity');
  const sheet = firstColumn(d, 'sheet-resistance');
  const configuration = d.metadata?.sample?.contacts?.configuration;
  const isFilm = d.metadata?.sample?.form === 'thin-film';
  if (rho) d.curves.push({ name: 'resistivity', quantity: 'resistivity', ucum: 'Ohm.m', x: d.x?.values ?? new Float64Array(n), y: rho.values });
  let sheetValues: Float64Array | null = sheet?.values ?? null;
  let sheetMethod = sheet ? `column ${sheet.name}` : '';
  if (!sheetValues && configuration === 'van-der-pauw') {
    sheetValues = vanDerPauwSheet(d);
    sheetMethod = 'R_s from exp(−πR_A/R_s) + exp(−πR_B/R_s) = 1 (van der Pauw 1958) on the first two R columns';
    if (!sheetValues) d.notComputed.push({ key: 'sheet-resistance', reason: 'van der Pauw needs two resistance columns (R_A and R_B).' });
  }
  const r = resistanceCurve(d);
  if (!rho && !sheetValues && r) {
    if (g?.lengthM && g.areaM2) {
      const k = resistivityFromCrossSection(1, g.areaM2, g.lengthM); // ρ = R·A/L, definition of resistivity
      d.curves.push({ name: 'resistivity', quantity: 'resistivity', ucum: 'Ohm.m', x: d.x?.values ?? new Float64Array(n), y: scaled(r, k) });
    } else if (g?.lengthM && g.widthM && (isFilm || configuration === 'hall-bar')) {
      const k = sheetResistanceFromBar(1, g.widthM, g.lengthM); // R_s = R·w/L, L/w squares
      sheetValues = scaled(r, k);
      sheetMethod = 'R_s = R·w/L (L/w squares between the voltage contacts)';
    } else {
      d.notComputed.push({ key: 'resistivity', reason: 'Resistivity needs the voltage-contact spacing and the cross-section (area, width × thickness, or diameter) in the sample geometry.' });
    }
  }
  const t = g?.thicknessM ?? null;
  if (sheetValues) {
    d.curves.push({ name: 'sheet-resistance', quantity: 'sheet-resistance', ucum: 'Ohm/{sq}', x: d.x?.values ?? new Float64Array(n), y: sheetValues });
    if (!curveOf(d, 'resistivity') && t) {
      const k = resistivityFromSheetResistance(1, t); // ρ = R_s·t
      d.curves.push({ name: 'resistivity', quantity: 'resistivity', ucum: 'Ohm.m', x: d.x?.values ?? new Float64Array(n), y: scaled(sheetValues, k) });
    }
  } else if (isFilm && t && curveOf(d, 'resistivity')) {
    const k = sheetResistanceFromResistivity(1, t); // R_s = ρ/t
    d.curves.push({ name: 'sheet-resistance', quantity: 'sheet-resistance', ucum: 'Ohm/{sq}', x: d.x?.values ?? new Float64Array(n), y: scaled((curveOf(d, 'resistivity') as { y: Float64Array }).y, k) });
    sheetMethod = 'R_s = ρ/t';
  }
  endpointValues(d, 'resistivity', 'ρ', 'Ohm.m', rho ? `column ${rho.name}` : curveOf(d, 'resistivity') ? (sheetValues && !rho ? 'ρ = R_s·t' : 'ρ = R·A/L (definition of resistivity)') : '');
  endpointValues(d, 'sheet-resistance', 'R_s', 'Ohm/{sq}', sheetMethod);
}

/** ρ (or R_s) at the two ends of the x range from the x-binned curve; for field sweeps at B = 0 and at the largest |B|. */
function endpointValues(d: Derivation, name: string, symbol: string, ucum: string, method: string): void {
  const c = curveOf(d, name);
  if (!c || !d.x || !d.x.converted) return;
  const binned = binnedPairs(d, c.x, c.y);
  if (binned.x.length === 0) return;
  const xName = d.x.quantity;
  const unit = d.x.siUcum ? `[${d.x.siUcum}]` : '';
  if (xName === 'field') {
    const even = fieldEvenCurve(binned);
    const zero = valueAtZeroField(even.curve);
    const last = even.curve.x.length - 1;
    if (zero !== null) d.derived.push({ key: `${name}.at-zero-field`, label: `${symbol} at B = 0`, value: round(zero), ucum, method, at: { [`field${unit}`]: 0 } });
    if (last >= 0) {
      d.derived.push({
        key: `${name}.at-max-field`, label: `${symbol} at the largest |B|${even.symmetrised ? ' (symmetrised over ±B)' : ''}`,
        value: round(even.curve.y[last]), ucum, method, at: { [`field${unit}`]: round(even.curve.x[last]) },
      });
    }
    return;
  }
  const ends = binned.x.length > 1 ? [0, binned.x.length - 1] : [0];
  for (const i of ends) {
    d.derived.push({
      key: `${name}.at-${i === 0 ? 'min' : 'max'}-${xName}`,
      label: `${symbol} at the ${i === 0 ? 'lowest' : 'highest'} ${xName}`,
      value: round(binned.y[i]),
      ucum,
      method,
      at: { [`${xName}${unit}`]: round(binned.x[i]) },
    });
  }
}
