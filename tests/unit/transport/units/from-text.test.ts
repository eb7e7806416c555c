import { describe, expect, it } from 'vitest';
import { ucumFromText, unitInfo } from '@/lib/transport/units';

// Header spellings seen in instrument files (common practice) and the UCUM code each must map to.
const CASES: [string, string][] = [
  ['K', 'K'], ['kelvin', 'K'], ['Kelvin', 'K'], ['mK', 'mK'], ['°C', 'Cel'], ['° C', 'Cel'], ['ºC', 'Cel'], ['deg C', 'Cel'],
  ['degC', 'Cel'], ['°F', '[degF]'], ['T', 'T'], ['tesla', 'T'], ['Tesla', 'T'], ['mT', 'mT'], ['G', 'G'], ['gauss', 'G'],
  ['Oe', 'Oe'], ['kOe', 'kOe'], ['Ohm', 'Ohm'], ['ohm', 'Ohm'], ['ohms', 'Ohm'], ['OHM', 'Ohm'],
  ['\u03A9', 'Ohm'], ['\u2126', 'Ohm'], ['m\u03A9', 'mOhm'], ['mOhm', 'mOhm'], ['mohm', 'mOhm'], ['milliohm', 'mOhm'],
  ['k\u03A9', 'kOhm'], ['kohm', 'kOhm'], ['KOHM', 'kOhm'], ['M\u03A9', 'MOhm'], ['Mohm', 'MOhm'], ['MOhm', 'MOhm'],
  ['\u00B5\u03A9 cm', 'uOhm.cm'], ['\u03BC\u03A9 cm', 'uOhm.cm'], ['uOhm cm', 'uOhm.cm'], ['uOhm-cm', 'uOhm.cm'],
  ['\u03BC\u03A9\u00B7cm', 'uOhm.cm'], ['\u00B5\u03A9\u00B7cm', 'uOhm.cm'], ['\u03A9 m', 'Ohm.m'], ['ohm*m', 'Ohm.m'],
  ['ohm-cm', 'Ohm.cm'], ['Ohm.cm', 'Ohm.cm'], ['Ohm/sq', 'Ohm/{sq}'], ['\u03A9/\u25A1', 'Ohm/{sq}'], ['ohms per square', 'Ohm/{sq}'],
  ['Ohm/{sq}', 'Ohm/{sq}'], ['k\u03A9/sq', 'kOhm/{sq}'],
  ['A', 'A'], ['mA', 'mA'], ['\u00B5A', 'uA'], ['\u03BCA', 'uA'], ['uA', 'uA'], ['nA', 'nA'], ['amps', 'A'],
  ['V', 'V'], ['mV', 'mV'], ['\u00B5V', 'uV'], ['nV', 'nV'], ['volts', 'V'], ['microvolt', 'uV'],
  ['Hz', 'Hz'], ['hz', 'Hz'], ['kHz', 'kHz'], ['mHz', 'mHz'], ['deg', 'deg'], ['°', 'deg'], ['degrees', 'deg'], ['rad', 'rad'],
  ['s', 's'], ['sec', 's'], ['seconds', 's'], ['min', 'min'], ['h', 'h'], ['ms', 'ms'],
  ['cm^2/Vs', 'cm2/(V.s)'], ['cm2/(V s)', 'cm2/(V.s)'], ['cm2/V.s', 'cm2/(V.s)'], ['cm^2/V*s', 'cm2/(V.s)'],
  ['cm^2 V^-1 s^-1', 'cm2/(V.s)'], ['cm\u00B2/(V\u00B7s)', 'cm2/(V.s)'], ['m^2/Vs', 'm2/(V.s)'],
  ['cm^-3', 'cm-3'], ['cm-3', 'cm-3'], ['cm\u207B\u00B3', 'cm-3'], ['cm-2', 'cm-2'], ['cm^-2', 'cm-2'],
  ['cm3/C', 'cm3/C'], ['cm^3/C', 'cm3/C'], ['m^3/C', 'm3/C'], ['%', '%'], ['percent', '%'], ['V^2/Hz', 'V2/Hz'],
  ['K/min', 'K/min'], ['T/min', 'T/min'], ['K/s', 'K/s'], ['(K)', 'K'], ['[Ohm]', 'Ohm'], ['  mV  ', 'mV'],
  ['\u00B5m', 'um'], ['nm', 'nm'], ['mm', 'mm'], ['W', 'W'], ['\u00B5W', 'uW'], ['nW', 'nW'], ['S', 'S'], ['A/m', 'A/m'],
];

describe('ucumFromText', () => {
  it.each(CASES)('reads %j as %s', (text, ucum) => {
    const r = ucumFromText(text);
    expect(r?.ucum).toBe(ucum);
    expect(r?.reason.length).toBeGreaterThan(5);
    expect(unitInfo(ucum)).toBeDefined(); // every answer is a unit the catalogue can convert
  });

  it('keeps the case of prefixes: milli is never turned into mega', () => {
    expect(ucumFromText('mOhm')?.ucum).toBe('mOhm');
    expect(ucumFromText('mT')?.ucum).toBe('mT');
    expect(ucumFromText('mohm')?.ucum).toBe('mOhm');
    expect(ucumFromText('MOhm')?.ucum).toBe('MOhm');
    expect(ucumFromText('mHz')?.ucum).toBe('mHz');
    expect(ucumFromText('MHz')?.ucum).toBe('MHz');
  });

  it('flags all-capital text read with a mega prefix as ambiguous', () => {
    expect(ucumFromText('MOHM')).toMatchObject({ ucum: 'MOhm', ambiguous: true });
    expect(ucumFromText('MV')).toMatchObject({ ucum: 'MV', ambiguous: true });
    expect(ucumFromText('mV')?.ambiguous).toBeUndefined();
  });

  it("reads a bare 'C' as °C but marks it ambiguous (UCUM 'C' is coulomb); a hint decides", () => {
    expect(ucumFromText('C')).toMatchObject({ ucum: 'Cel', ambiguous: true });
    expect(ucumFromText('C')?.reason).toMatch(/coulomb/);
    expect(ucumFromText('C', { dimension: 'temperature' })).toEqual({ ucum: 'Cel', reason: expect.any(String) });
    expect(ucumFromText('C', { dimension: 'charge' })?.ucum).toBe('C');
    expect(ucumFromText('cm3/C')?.ucum).toBe('cm3/C'); // inside a compound it stays coulomb
    expect(ucumFromText('F', { dimension: 'temperature' })?.ucum).toBe('[degF]');
  });

  it('returns undefined for text that is not a known unit', () => {
    for (const t of ['', '   ', 'a.u.', 'arb. units', 'counts', 'V/\u221AHz', 'nV/sqrt(Hz)', '10^-3 V', 'Ohm/K']) {
      expect(ucumFromText(t), t).toBeUndefined();
    }
  });
});
