import type { ParsedColumn } from '@/lib/transport/parse';
import {
  antisymmetriseOverField,
  carrierDensityFromHall,
  hallMobility,
  magnetoresistance,
  sheetCarrierDensityFromHall,
  sheetHallMobility,
} from '@/lib/transport/physics';
import { linearFit } from './curves';
import { bothSigns, fieldEvenCurve as evenCurve, valueAtZeroField as atZero } from './field-curves';
import { binned as binnedPairs, curveOf, firstColumn, round, type Derivation } from './derivation';
import { resistanceCurve } from './derive-resistivity';

/** MR = [R(B) − R(0)]/R(0) at the largest |B|, on the symmetrised R_xx (definition; Onsager symmetrisation). */
export function deriveMagnetoresistance(d: Derivation, field: ParsedColumn): void {
  const r = resistanceCurve(d);
  if (!r) return;
  const { curve, symmetrised } = evenCurve(binnedPairs(d, field.values, r));
  const r0 = atZero(curve);
  if (r0 === null || r0 === 0) {
    d.notComputed.push({ key: 'magnetoresistance', reason: 'Magnetoresistance needs a reading at (or very near) zero field.' });
    return;
  }
  const last = curve.x.length - 1;
  d.derived.push({
    key: 'magnetoresistance.at-max-field',
    label: 'MR = [R(B) − R(0)]/R(0) at the largest |B|',
    value: round(magnetoresistance(curve.y[last], r0) * 100),
    ucum: '%',
    method: `definition, on ${symmetrised ? 'R_xx symmetrised over ±B (Onsager)' : 'the measured branch (one field sign only)'}`,
    at: { 'field[T]': round(curve.x[last]) },
    detail: { r0Ohm: round(r0), symmetrised },
  });
  d.curves.push({ name: 'magnetoresistance', quantity: 'magnetoresistance', ucum: '%', x: Float64Array.from(curve.x), y: Float64Array.from(curve.y, (v) => magnetoresistance(v, r0) * 100) });
}

function hallSource(d: Derivation): { values: Float64Array; kind: 'sheet' | 'bulk'; name: string } | null {
  const rxy = firstColumn(d, 'hall-resistance');
  if (rxy) return { values: rxy.values, kind: 'sheet', name: rxy.name };
  const rhoxy = firstColumn(d, 'hall-resistivity');
  if (rhoxy) return { values: rhoxy.values, kind: 'bulk', name: rhoxy.name };
  const vxy = d.columns.find((c) => c.quantity === 'voltage' && c.siUcum === 'V' && /xy|yx|hall|^vh$/i.test(c.name));
  if (vxy && d.currentA) return { values: vxy.values.map((v) => v / (d.currentA as number)), kind: 'sheet', name: `${vxy.name}/I` };
  return null;
}

const E_CM = { perM2ToPerCm2: 1e-4, perM3ToPerCm3: 1e-6, m3PerCToCm3PerC: 1e6, m2PerVsToCm2PerVs: 1e4 };

/** Hall coefficient from the slope of R_xy(B) (antisymmetrised over ±B), carrier density and mobility (single band). */
export function deriveHall(d: Derivation, field: ParsedColumn): void {
  const src = hallSource(d);
  if (!src) return;
  const binned = binnedPairs(d, field.values, src.values);
  if (binned.x.length < 3) return;
  let fit: { slope: number };
  let antisymmetrised = false;
  if (bothSigns(binned)) {
    const a = antisymmetriseOverField(binned.x, binned.y);
    fit = linearFit(a.absFieldT, a.values, true); // odd part vanishes at B = 0 by construction
    antisymmetrised = true;
  } else fit = linearFit(binned.x, binned.y);
  if (!Number.isFinite(fit.slope) || fit.slope === 0) return;
  const t = d.geometry?.thicknessM ?? null;
  const method = `slope of ${src.name} vs B, ${antisymmetrised ? 'antisymmetrised over ±B (Onsager)' : 'linear fit'}; single-band Drude model`;
  const bulk = src.kind === 'bulk' ? fit.slope : t ? fit.slope * t : null; // R_H = R_H,s·t
  if (src.kind === 'sheet') {
    const ns = sheetCarrierDensityFromHall(fit.slope); // n_s = 1/(e|R_H,s|)
    d.derived.push({ key: 'hall.sheet-coefficient', label: 'Sheet Hall coefficient R_H,s = dR_xy/dB', value: round(fit.slope), ucum: 'm2/C', method });
    d.derived.push({ key: 'hall.sheet-density', label: 'Sheet carrier density n_s = 1/(e|R_H,s|)', value: round(ns.densityPerM2 * E_CM.perM2ToPerCm2), ucum: 'cm-2', method: 'NIST Hall-effect method; ASTM F76', detail: { carrierType: ns.carrierType } });
  }
  if (bulk !== null) {
    const n = carrierDensityFromHall(bulk); // n = 1/(e|R_H|)
    d.derived.push({ key: 'hall.coefficient', label: 'Hall coefficient R_H', value: round(bulk * E_CM.m3PerCToCm3PerC), ucum: 'cm3/C', method: src.kind === 'sheet' ? `${method}; R_H = R_H,s·t` : method });
    d.derived.push({ key: 'hall.density', label: 'Carrier density n = 1/(e|R_H|)', value: round(n.densityPerM3 * E_CM.perM3ToPerCm3), ucum: 'cm-3', method: 'NIST Hall-effect method; ASTM F76', detail: { carrierType: n.carrierType } });
  }
  hallMobilityValue(d, field, src.kind === 'sheet' ? fit.slope : null, bulk);
}

function zeroFieldValue(d: Derivation, field: ParsedColumn, name: string): number | null {
  const c = curveOf(d, name);
  return c ? atZero(evenCurve(binnedPairs(d, field.values, c.y)).curve) : null;
}

function hallMobilityValue(d: Derivation, field: ParsedColumn, sheetCoefficient: number | null, bulkCoefficient: number | null): void {
  const rho0 = zeroFieldValue(d, field, 'resistivity');
  const rs0 = zeroFieldValue(d, field, 'sheet-resistance');
  let mu: number | null = null;
  let method = '';
  if (bulkCoefficient !== null && rho0 && rho0 > 0) [mu, method] = [hallMobility(bulkCoefficient, rho0), 'μ = |R_H|/ρ(B = 0)'];
  else if (sheetCoefficient !== null && rs0 && rs0 > 0) [mu, method] = [sheetHallMobility(sheetCoefficient, rs0), 'μ = |R_H,s|/R_s(B = 0) = 1/(e n_s R_s)'];
  if (mu === null) {
    d.notComputed.push({ key: 'hall.mobility', reason: 'Mobility needs the zero-field resistivity or sheet resistance: an R_xx column plus the sample geometry.' });
    return;
  }
  d.derived.push({ key: 'hall.mobility', label: 'Hall mobility μ', value: round(Math.abs(mu) * E_CM.m2PerVsToCm2PerVs), ucum: 'cm2/(V.s)', method, detail: { signed: round(mu * E_CM.m2PerVsToCm2PerVs) } });
}
