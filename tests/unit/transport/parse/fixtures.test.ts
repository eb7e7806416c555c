import { describe, expect, it } from 'vitest';
import { CU_WIRE, FILM, HALL_BAR, cuAreaM2, cuResistivity, hallRxx, hallRxy } from '../../../fixtures/transport/params';
import { column, parseFixture } from './helpers';

describe('parseTransportTable on the fixtures', () => {
  it('reads the Cu wire R(T) CSV: comment metadata, units in headers, mΩ → Ω', async () => {
    const t = await parseFixture('cu-wire-rt.csv');
    expect(t).toMatchObject({ delimiter: ',', decimalSeparator: '.', encoding: 'utf-8', headerLine: 6, firstDataLine: 7, rowCount: CU_WIRE.temperaturesK.length, warnings: [] });
    expect(t.headerMetadata).toEqual({
      Sample: 'LCL-Cu-W07',
      Material: 'copper wire, annealed',
      'Voltage contact spacing': '20 mm',
      Excitation: '1 mA AC at 13.7 Hz, digital lock-in',
    });
    const T = column(t, 'T');
    const R = column(t, 'R');
    expect(T).toMatchObject({ quantity: 'temperature', ucum: 'K', siUcum: 'K', rawHeader: 'T (K)', range: { min: 2, max: 300 } });
    expect(R).toMatchObject({ quantity: 'resistance', ucum: 'mOhm', siUcum: 'Ohm', converted: true, nanCount: 0 });
    expect(R.reason).toBe("header 'R [mOhm]': name R → resistance; unit in brackets mOhm → UCUM mOhm");
    expect(R.confidence).toBeGreaterThan(0.9);
    expect(column(t, 'I')).toMatchObject({ quantity: 'current', ucum: 'mA', siUcum: 'A' });
    expect(column(t, 'I').values[0]).toBe(0.001);
    // First row is T = 300 K (cooling); R = ρL/A with ρ from the generating Bloch–Grüneisen model (params.ts).
    expect(T.values[0]).toBe(300);
    expect(R.values[0]).toBeCloseTo((cuResistivity(300) * CU_WIRE.lengthM) / cuAreaM2(), 10);
  });

  it('reads the thin-film file: ";" separators, decimal commas, "!" comments, Ω/sq and µA', async () => {
    const t = await parseFixture('tidewater-film-rs.csv');
    expect(t).toMatchObject({ delimiter: ';', decimalSeparator: ',', rowCount: FILM.temperaturesK.length, headerMetadata: { Thickness: '100 nm' } });
    const rs = column(t, 'Rs');
    expect(rs).toMatchObject({ quantity: 'sheet-resistance', ucum: 'Ohm/{sq}', siUcum: 'Ohm/{sq}' });
    expect(column(t, 'T').values[0]).toBe(4.2); // '4,2' in the file
    expect(rs.values[0]).toBe(1.021);
    expect(column(t, 'I')).toMatchObject({ ucum: 'uA', siUcum: 'A' });
    expect(column(t, 'I').values[0]).toBe(1e-5);
  });

  it('reads the whitespace Hall-bar sweep with ";" comments and CRLF; Oe → T by the lab convention', async () => {
    const t = await parseFixture('cobalt-ridge-hallbar.dat');
    expect(t).toMatchObject({ delimiter: 'whitespace', rowCount: HALL_BAR.fieldsOe.length, warnings: [], headerMetadata: { Device: 'CRM-HB-03 (Hall bar, w = 1 mm, L = 2 mm)', Temperature: '2.0 K' } });
    expect(t.columns.map((c) => [c.name, c.quantity, c.ucum])).toEqual([
      ['Field', 'field', 'Oe'],
      ['Rxx', 'resistance', 'Ohm'],
      ['Rxy', 'hall-resistance', 'Ohm'],
      ['T', 'temperature', 'K'],
    ]);
    const field = column(t, 'Field');
    expect(field.siUcum).toBe('T');
    expect(field.reason).toContain('1 Oe ↔ 1e-4 T');
    expect(field.range).toEqual({ min: -9, max: 9 }); // ±90 kOe
    expect(field.values[1]).toBe(-8.9);
    expect(column(t, 'Rxx').values[90]).toBeCloseTo(hallRxx(0), 8);
    expect(column(t, 'Rxy').values[180]).toBeCloseTo(hallRxy(9), 7);
  });

  it('reads the Latin-1 file: µ (0xB5) and ° (0xB0), µΩ·cm → Ω·m, °C → K', async () => {
    const t = await parseFixture('latin1-cuni-rho.csv');
    expect(t.encoding).toBe('latin1');
    expect(t.rowCount).toBe(30);
    const rho = column(t, 'rho');
    expect(rho).toMatchObject({ rawHeader: 'rho (µOhm cm)', quantity: 'resistivity', ucum: 'uOhm.cm', siUcum: 'Ohm.m' });
    expect(rho.values[0]).toBe(4.891e-7); // 48.91 µΩ·cm, 1 µΩ·cm = 1e-8 Ω·m
    const tset = column(t, 'Tset');
    expect(tset).toMatchObject({ rawHeader: 'Tset (°C)', quantity: 'temperature', ucum: 'Cel', siUcum: 'K' });
    expect(tset.values[0]).toBeCloseTo(10, 9); // −263.15 °C = 10 K (K = °C + 273.15)
  });

  it('reads the UTF-16 LE lock-in TSV: X, Y, R in µV and θ in degrees', async () => {
    const t = await parseFixture('utf16-lockin.tsv');
    expect(t).toMatchObject({ encoding: 'utf-16le', delimiter: '\t', rowCount: 20 });
    expect(t.columns.map((c) => c.quantity)).toEqual(['time', 'lock-in-x', 'lock-in-y', 'lock-in-r', 'lock-in-phase']);
    expect(column(t, 'X').values[0]).toBe(8.660254038e-6);
    expect(column(t, 'R').reason).toContain('with X and Y columns present → lock-in-r');
    expect(column(t, 'Theta').values[0]).toBeCloseTo(Math.PI / 6, 12); // 30° in rad
  });

  it('renames duplicate headers and counts NaN, "nan", "--", "N/A" and blank cells', async () => {
    const t = await parseFixture('duplicate-headers-nan.csv');
    expect(t.columns.map((c) => c.name)).toEqual(['T', 'R', 'R_2', 'V']);
    expect(t.warnings).toEqual([{ line: 1, code: 'duplicate-header', column: 'R_2', message: "The header names 'R' more than once; column 3 is renamed R_2." }]);
    expect(Array.from(column(t, 'R').values)).toEqual([1.5, NaN, NaN, 1.8]);
    expect(column(t, 'R').nanCount).toBe(2);
    expect(column(t, 'R_2').nanCount).toBe(1);
    expect(column(t, 'V').nanCount).toBe(2);
    expect(column(t, 'V').range).toEqual({ min: 0.00015, max: 0.00018 });
  });

  it('reads [Header] … [Data] sections with key,value metadata', async () => {
    const t = await parseFixture('sectioned-export.csv');
    expect(t.headerMetadata).toEqual({ Title: 'Cooldown 12 of sample LCL-Nb-01', Operator: 'Imogen Vale', Date: '2031-04-02', 'Excitation (mA)': '0.5' });
    expect(t).toMatchObject({ headerLine: 7, firstDataLine: 8, rowCount: 30 });
    expect(t.columns.map((c) => [c.name, c.quantity, c.siUcum])).toEqual([
      ['Time Stamp', 'time', 's'],
      ['Temperature', 'temperature', 'K'],
      ['Field', 'field', 'T'],
      ['Resistance', 'resistance', 'Ohm'],
    ]);
  });

  it('pads short rows with NaN and skips long rows, with line numbers', async () => {
    const t = await parseFixture('inconsistent-columns.csv');
    expect(t.rowCount).toBe(3);
    expect(t.warnings).toEqual([
      { line: 3, code: 'short-row', message: 'Line 3 has 2 values but the table has 3 columns; the missing values are NaN.' },
      { line: 4, code: 'long-row', message: 'Line 4 has 4 values but the table has 3 columns; the row is skipped.' },
    ]);
    expect(Array.from(column(t, 'T').values)).toEqual([1, 2, 4]);
    expect(Array.from(column(t, 'I').values)).toEqual([0.001, NaN, 0.001]);
  });
});
