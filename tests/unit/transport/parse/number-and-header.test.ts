import { describe, expect, it } from 'vitest';
import { quantityFromName, splitHeaderCell } from '@/lib/transport/parse';
import { CELL_BLANK, CELL_MISSING, CELL_NUMBER, CELL_TEXT, NumberReader } from '@/lib/transport/parse/number';
import { detectLayout } from '@/lib/transport/parse/delimiter';

const reader = new NumberReader();
const read = (s: string, decimal = '.', shift = 0) => {
  const v = reader.read(s, 0, s.length, decimal.charCodeAt(0), shift);
  return { v, kind: reader.kind };
};

describe('NumberReader', () => {
  it('agrees bit for bit with Number() on 20 000 pseudo-random decimal strings (Clinger fast path)', () => {
    let seed = 12345;
    const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (let i = 0; i < 20000; i++) {
      const digits = 1 + Math.floor(rand() * 17);
      const mantissa = Math.floor(rand() * 10 ** Math.min(digits, 15)).toString();
      const point = Math.floor(rand() * (mantissa.length + 1));
      const exp = rand() < 0.3 ? `e${Math.floor(rand() * 60) - 30}` : '';
      const sign = rand() < 0.3 ? '-' : '';
      const text = `${sign}${mantissa.slice(0, point)}.${mantissa.slice(point)}${exp}`.replace(/^(-?)\./, '$10.');
      expect(read(text).v, text).toBe(Number(text));
    }
  });

  it('reads signs, exponents, quotes and spaces; classifies blanks, missing markers and text', () => {
    expect(read(' +1.25E+3 ')).toEqual({ v: 1250, kind: CELL_NUMBER });
    expect(read('"-0.5"')).toEqual({ v: -0.5, kind: CELL_NUMBER });
    expect(read('.5')).toEqual({ v: 0.5, kind: CELL_NUMBER });
    expect(read('12345678901234567890').v).toBe(12345678901234567890);
    expect(read('-inf')).toEqual({ v: -Infinity, kind: CELL_NUMBER });
    expect(read('  ').kind).toBe(CELL_BLANK);
    for (const m of ['NaN', 'nan', '--', 'N/A', 'null']) expect(read(m).kind, m).toBe(CELL_MISSING);
    for (const t of ['1.2.3', '12abc', 'e5', '1e', '0x10', 'ten']) expect(read(t).kind, t).toBe(CELL_TEXT);
  });

  it('reads decimal commas and folds a unit prefix into the exponent exactly', () => {
    expect(read('1,7241', ',')).toEqual({ v: 1.7241, kind: CELL_NUMBER });
    expect(read('1.5', ',').kind).toBe(CELL_TEXT);
    expect(read('12.5', '.', -3).v).toBe(0.0125); // 12.5 mΩ = 0.0125 Ω
    expect(read('15.3', '.', -3).v).toBe(0.0153);
    expect(read('48.91', '.', -8).v).toBe(4.891e-7); // µΩ·cm → Ω·m
    expect(read('1.2345678901234567', '.', -3).v).toBe(Number('1.2345678901234567e-3'));
  });
});

describe('header cells', () => {
  it.each([
    ['T (K)', 'T', 'K'],
    ['R [mOhm]', 'R', 'mOhm'],
    ['B/T', 'B', 'T'],
    ['rho (µΩ cm)', 'rho', 'µΩ cm'],
    ['Rxx_Ohm', 'Rxx', 'Ohm'],
    ['Temperature (K)', 'Temperature', 'K'],
    ['Field (Oe)', 'Field', 'Oe'],
    ['Temperature K', 'Temperature', 'K'],
    ['"V (mV)"', 'V', 'mV'],
    ['T_sample', 'T_sample', null],
    ['R_xx', 'R_xx', null],
    ['V_g', 'V_g', null], // 'g' is gram, not a voltage unit: no split
    ['Rxy/Rxx', 'Rxy/Rxx', null],
  ])('%s → name %s, unit %s', (raw, name, unit) => {
    expect(splitHeaderCell(raw)).toEqual({ name, unitText: unit });
  });

  it.each([
    ['T', 'temperature'], ['Temp', 'temperature'], ['T_sample', 'temperature'], ['Temperature', 'temperature'],
    ['B', 'field'], ['H', 'field'], ['Field', 'field'], ['Magnetic Field', 'field'],
    ['R', 'resistance'], ['Rxx', 'resistance'], ['R_xx', 'resistance'], ['Resistance', 'resistance'], ['R2', 'resistance'],
    ['Rxy', 'hall-resistance'], ['rho', 'resistivity'], ['rho_xy', 'hall-resistivity'], ['Rs', 'sheet-resistance'],
    ['V', 'voltage'], ['Vx', 'voltage'], ['X', 'lock-in-x'], ['Y', 'lock-in-y'], ['I', 'current'], ['Current', 'current'],
    ['f', 'frequency'], ['freq', 'frequency'], ['theta', 'angle'], ['angle', 'angle'], ['time', 'time'], ['t', 'time'],
    ['Vg', 'gate-voltage'], ['MR', 'magnetoresistance'],
  ])('name %s → %s', (name, quantity) => {
    expect(quantityFromName(name)?.quantity).toBe(quantity);
  });

  it('leaves unknown names unmapped', () => {
    expect(quantityFromName('Comment')).toBeUndefined();
    expect(quantityFromName('')).toBeUndefined();
  });
});

describe('delimiter detection', () => {
  it.each([
    [['1.5,2.5,3', '2.5,3.5,4'], ',', '.', 3],
    [['1,5;2,5;3', '2,5;3,5;4'], ';', ',', 3],
    [['1.5\t2.5', '2\t3'], '\t', '.', 2],
    [['1,5\t2,5', '2,1\t3,1'], '\t', ',', 2],
    [['  1.5   2.5  3', ' 2 3 4'], 'whitespace', '.', 3],
    [['1,5 2,5', '2,5 3,5'], 'whitespace', ',', 2],
    [['2031-04-02 10:00:00,1.5,2.5', '2031-04-02 10:00:01,1.6,2.6'], ',', '.', 3],
    [['1.5,2.5,3,', '2.5,3.5,4,'], ',', '.', 3],
    [['1.5', '2.5'], 'whitespace', '.', 1],
  ])('%j → %j, decimal %j, %i columns', (lines, delimiter, decimalSeparator, columnCount) => {
    expect(detectLayout(lines)).toEqual({ delimiter, decimalSeparator, columnCount });
  });
});
