import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { CATALOGUE_UCUM, fromSi, toSi, unitInfo } from '@/lib/transport/units';

// The design notes' "Units" list (../shared/design/domain.md) plus the extras this module promises.
const REQUIRED = [
  'K', 'mK', 'Cel', 'T', 'mT', 'G', 'Oe', 'kOe', 'Ohm', 'mOhm', 'kOhm', 'MOhm', 'Ohm.m', 'Ohm.cm', 'uOhm.cm',
  'Ohm/{sq}', 'A', 'mA', 'uA', 'nA', 'V', 'mV', 'uV', 'nV', 'Hz', 'deg', 's', 'cm2/(V.s)', 'cm-3', 'cm-2', 'cm3/C',
  'm', 'mm', 'um', 'nm', 'cm', 'S', 'W', 'uW', 'nW', 'rad', 'min', 'h', '%', '1', 'V2/Hz', 'K/min', 'T/min',
];

// Independent oracle: js-quantities spelling of each unit and of its SI unit. Temperatures use its absolute
// scales (tempK/tempC/tempF). cm^2/V*s means cm²/(V·s) in js-quantities (everything after '/' is denominator).
const JS_QUANTITIES: Record<string, [string, string]> = {
  K: ['tempK', 'tempK'], mK: ['mdegK', 'degK'], Cel: ['tempC', 'tempK'], '[degF]': ['tempF', 'tempK'],
  T: ['T', 'T'], mT: ['mT', 'T'], G: ['G', 'T'], Oe: ['Oe', 'A/m'], kOe: ['kOe', 'A/m'], 'A/m': ['A/m', 'A/m'],
  Ohm: ['ohm', 'ohm'], mOhm: ['mohm', 'ohm'], kOhm: ['kohm', 'ohm'], MOhm: ['Mohm', 'ohm'],
  'Ohm.m': ['ohm*m', 'ohm*m'], 'Ohm.cm': ['ohm*cm', 'ohm*m'], 'uOhm.cm': ['uohm*cm', 'ohm*m'],
  A: ['A', 'A'], mA: ['mA', 'A'], uA: ['uA', 'A'], nA: ['nA', 'A'], V: ['V', 'V'], mV: ['mV', 'V'], uV: ['uV', 'V'], nV: ['nV', 'V'],
  Hz: ['Hz', 'Hz'], deg: ['deg', 'rad'], rad: ['rad', 'rad'], s: ['s', 's'], min: ['min', 's'], h: ['h', 's'],
  'cm2/(V.s)': ['cm^2/V*s', 'm^2/V*s'], 'm2/(V.s)': ['m^2/V*s', 'm^2/V*s'], 'cm-3': ['cm^-3', 'm^-3'], 'm-3': ['m^-3', 'm^-3'],
  'cm-2': ['cm^-2', 'm^-2'], 'm-2': ['m^-2', 'm^-2'], 'cm3/C': ['cm^3/C', 'm^3/C'], 'm3/C': ['m^3/C', 'm^3/C'],
  m: ['m', 'm'], mm: ['mm', 'm'], um: ['um', 'm'], nm: ['nm', 'm'], cm: ['cm', 'm'], S: ['S', 'S'],
  W: ['W', 'W'], uW: ['uW', 'W'], nW: ['nW', 'W'], '%': ['%', ''], 'V2/Hz': ['V^2/Hz', 'V^2/Hz'],
  'K/min': ['degK/min', 'degK/s'], 'T/min': ['T/min', 'T/s'],
};
// Units js-quantities cannot express: UCUM annotations ({sq}) and the unity code '1'.
const NOT_IN_JS_QUANTITIES = ['Ohm/{sq}', '1'];

describe('unit catalogue', () => {
  it('knows every unit of the design notes and of the brief', () => {
    for (const code of REQUIRED) expect(unitInfo(code), code).toBeDefined();
    expect(CATALOGUE_UCUM).toEqual(expect.arrayContaining(REQUIRED));
  });

  it('assigns dimensions and SI units', () => {
    const expected: Record<string, [string, string]> = {
      mK: ['temperature', 'K'], Cel: ['temperature', 'K'], G: ['magneticFluxDensity', 'T'], kOe: ['magneticFieldStrength', 'A/m'],
      mOhm: ['resistance', 'Ohm'], 'uOhm.cm': ['resistivity', 'Ohm.m'], 'Ohm/{sq}': ['sheetResistance', 'Ohm/{sq}'],
      nA: ['current', 'A'], uV: ['voltage', 'V'], deg: ['angle', 'rad'], 'cm2/(V.s)': ['mobility', 'm2/(V.s)'],
      'cm-3': ['carrierDensity', 'm-3'], 'cm-2': ['sheetCarrierDensity', 'm-2'], 'cm3/C': ['hallCoefficient', 'm3/C'],
      S: ['conductance', 'S'], nW: ['power', 'W'], '%': ['dimensionless', '1'], 'V2/Hz': ['voltageNoisePsd', 'V2/Hz'],
      'K/min': ['temperatureRate', 'K/s'], 'T/min': ['magneticFluxDensityRate', 'T/s'], h: ['time', 's'], um: ['length', 'm'],
    };
    for (const [code, [dimension, siUcum]] of Object.entries(expected)) {
      expect(unitInfo(code), code).toMatchObject({ ucum: code, dimension, siUcum });
    }
  });

  it('Oe is a field strength in A/m: 1 Oe = 1000/(4π) A/m (SI Brochure 9th ed., Table 9, CGS units)', () => {
    const oe = unitInfo('Oe');
    expect(oe?.dimension).toBe('magneticFieldStrength');
    expect(oe?.siUcum).toBe('A/m');
    expect(oe?.factor).toBeCloseTo(1000 / (4 * Math.PI), 12);
  });

  it('has an offset only for the affine temperature scales', () => {
    for (const code of CATALOGUE_UCUM) {
      const info = unitInfo(code);
      if (code === 'Cel' || code === '[degF]') continue;
      expect(info?.offset, code).toBe(0);
    }
    expect(unitInfo('Cel')).toMatchObject({ factor: 1, offset: 273.15 }); // SI: t/°C = T/K − 273.15
    expect(unitInfo('[degF]')?.factor).toBeCloseTo(5 / 9, 14); // NIST SP 811, B.8: T/K = (t/°F + 459.67)/1.8
    expect(unitInfo('[degF]')?.offset).toBeCloseTo(459.67 / 1.8, 10);
  });

  it('gives practitioner labels', () => {
    expect(unitInfo('uOhm.cm')?.label).toBe('µΩ·cm');
    expect(unitInfo('cm2/(V.s)')?.label).toBe('cm²/(V·s)');
    expect(unitInfo('cm-3')?.label).toBe('cm⁻³');
    expect(unitInfo('Ohm/{sq}')?.label).toBe('Ω/sq');
    expect(unitInfo('Cel')?.label).toBe('°C');
  });

  it('returns undefined for invalid codes, blanks and wrong case', () => {
    for (const code of ['', 'ohm', 'OHM', 'kelvin', 'uOhm cm', 'mt', 'xyz']) expect(unitInfo(code), code).toBeUndefined();
  });

  it('agrees with js-quantities for every catalogue unit it knows (independent second library)', () => {
    const covered = new Set([...Object.keys(JS_QUANTITIES), ...NOT_IN_JS_QUANTITIES]);
    for (const code of CATALOGUE_UCUM) expect(covered.has(code), `${code} has an oracle or a reason`).toBe(true);
    for (const [code, [jq, jqSi]] of Object.entries(JS_QUANTITIES)) {
      // Positive values: js-quantities refuses absolute temperatures below zero.
      for (const value of [1.2345, 37.5, 250]) {
        const expected = Qty(`${value} ${jq}`).to(jqSi).scalar;
        const got = toSi(value, code);
        expect(Math.abs(got - expected), `${value} ${code}`).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));
        expect(fromSi(got, code)).toBeCloseTo(value, 10);
      }
    }
  });
});
