// Display units of the compare view against lib/transport's UCUM-based catalogue, and a second check by hand.
import { describe, expect, it } from 'vitest';
import { DISPLAY_UNIT_TABLE, findUnit, OERSTED_CONVENTION_NOTE, preferredUnit, unitOptions } from '@/lib/compare/units';
import { convertValue, fieldToTesla, unitInfo } from '@/lib/transport/units';

describe('the display-unit table agrees with lib/transport/units', () => {
  for (const [si, units] of Object.entries(DISPLAY_UNIT_TABLE)) {
    for (const u of units) {
      it(`1 ${u.ucum} = ${u.factor} ${si}`, () => {
        // Oe and kOe are field strength (A/m): the lab convention 1 Oe ↔ 1e-4 T, as the parser applies it.
        const expected = u.convention ? fieldToTesla(1, u.ucum) : convertValue(1, u.ucum, si);
        expect(u.factor).toBeCloseTo(expected, 12);
        expect(Math.abs(u.factor - expected) / expected).toBeLessThan(1e-12);
        if (!u.convention) expect(unitInfo(u.ucum)?.dimension).toBe(unitInfo(si)?.dimension);
      });
    }
  }

  it('lists the SI unit first for every quantity', () => {
    for (const [si, units] of Object.entries(DISPLAY_UNIT_TABLE)) expect(units[0]).toMatchObject({ ucum: si, factor: 1 });
  });
});

describe('by hand (SI prefixes: BIPM SI Brochure, 9th ed., Table 7)', () => {
  it('1 µΩ·cm = 1e-6 Ω × 1e-2 m = 1e-8 Ω·m', () => {
    expect(findUnit('Ohm.m', 'uOhm.cm')?.factor).toBe(1e-8);
    expect(findUnit('Ohm.m', 'uOhm.cm')?.label).toBe('µΩ·cm');
  });
  it('1 Ω·cm = 1e-2 Ω·m, 1 mΩ·cm = 1e-5 Ω·m', () => {
    expect(findUnit('Ohm.m', 'Ohm.cm')?.factor).toBe(1e-2);
    expect(findUnit('Ohm.m', 'mOhm.cm')?.factor).toBe(1e-5);
  });
  it('1 kOe ↔ 0.1 T and 1 Oe ↔ 1e-4 T by the stated lab convention (B = μ0·H in vacuum)', () => {
    expect(findUnit('T', 'kOe')).toMatchObject({ factor: 0.1, convention: OERSTED_CONVENTION_NOTE });
    expect(findUnit('T', 'Oe')?.factor).toBe(1e-4);
    expect(OERSTED_CONVENTION_NOTE).toContain('1 Oe ↔ 1e-4 T');
  });
  it('1 mK = 1e-3 K, 1 kΩ/sq = 1000 Ω/sq', () => {
    expect(findUnit('K', 'mK')?.factor).toBe(1e-3);
    expect(findUnit('Ohm/{sq}', 'kOhm/{sq}')?.factor).toBe(1000);
  });
});

describe('preferredUnit', () => {
  it('resistivity of a metal in µΩ·cm, of a semiconductor in Ω·cm (common practice), SI when asked', () => {
    expect(preferredUnit('Ohm.m', 1.9e-8).ucum).toBe('uOhm.cm'); // copper at 300 K, 1.9 µΩ·cm
    expect(preferredUnit('Ohm.m', 4.2e-6).ucum).toBe('uOhm.cm'); // an ITO film, 420 µΩ·cm
    expect(preferredUnit('Ohm.m', 0.05).ucum).toBe('Ohm.cm'); // doped silicon, 5 Ω·cm
    expect(preferredUnit('Ohm.m', 1.9e-8, 'si').ucum).toBe('Ohm.m');
  });
  it('a prefix that leaves 1–999; field stays in T; never Oe unless chosen', () => {
    expect(preferredUnit('Ohm', 0.044).ucum).toBe('mOhm');
    expect(preferredUnit('Ohm', 44).ucum).toBe('Ohm');
    expect(preferredUnit('Ohm', 4400).ucum).toBe('kOhm');
    expect(preferredUnit('K', 300).ucum).toBe('K');
    expect(preferredUnit('K', 0.05).ucum).toBe('mK');
    expect(preferredUnit('T', 0.005).ucum).toBe('T');
  });
  it('units it does not know are shown as they are; values of an unknown unit say so', () => {
    expect(unitOptions('m2/(V.s)')).toEqual([{ ucum: 'm2/(V.s)', label: 'm2/(V.s)', factor: 1 }]);
    expect(unitOptions(null)[0].label).toBe('unit unknown');
  });
});
