import { Readable } from 'node:stream';
import iconv from 'iconv-lite';
import { describe, expect, it } from 'vitest';
import { bytesFromBuffer, bytesFromWebStream, detectEncoding, parseTransportTable, parseTransportText } from '@/lib/transport/parse';
import { column, fixture } from './helpers';

const TABLE = 'Temp (°C)\trho (µΩ cm)\n20\t1,7241\n21\t1,7309\n';

describe('encodings', () => {
  it.each([
    ['utf-8', iconv.encode(TABLE, 'utf-8')],
    ['utf-8', iconv.encode(TABLE, 'utf-8', { addBOM: true })],
    ['utf-16le', iconv.encode(TABLE, 'utf-16le', { addBOM: true })],
    ['utf-16le', iconv.encode(TABLE, 'utf-16le')],
    ['utf-16be', iconv.encode(TABLE, 'utf-16be', { addBOM: true })],
    ['utf-16be', iconv.encode(TABLE, 'utf-16be')],
  ])('%s (%#) gives the same table, µΩ·cm and °C included', async (encoding, bytes) => {
    const t = await parseTransportText(bytes);
    expect(t.encoding).toBe(encoding);
    expect(t.decimalSeparator).toBe(',');
    expect(column(t, 'rho')).toMatchObject({ rawHeader: 'rho (µΩ cm)', ucum: 'uOhm.cm', siUcum: 'Ohm.m' });
    expect(Array.from(column(t, 'rho').values)).toEqual([1.7241e-8, 1.7309e-8]); // IACS copper 1.72414 µΩ·cm (IEC 60028), rounded
    expect(column(t, 'Temp').values[0]).toBeCloseTo(293.15, 10);
  });

  it('Latin-1 without C1 bytes is latin1; with 0x80–0x9F it is Windows-1252', async () => {
    const latin = iconv.encode('T (K),rho (µOhm cm)\n1,2\n', 'latin1');
    expect(detectEncoding(latin, true)).toMatchObject({ encoding: 'latin1' });
    const cp1252 = iconv.encode('# “quoted” note – en dash\nT (K),R (Ohm)\n1,2\n', 'windows-1252');
    const t = await parseTransportText(cp1252);
    expect(t.encoding).toBe('windows-1252');
    expect(t.headerMetadata).toEqual({});
    expect(column(t, 'R').values[0]).toBe(2);
  });

  it('a Symbol-font Ω ("W") in a resistance header is read as ohm, with a warning', async () => {
    const t = await parseTransportText(iconv.encode('T (K),R (mW)\n1,12.5\n', 'latin1'));
    expect(column(t, 'R')).toMatchObject({ ucum: 'mOhm', siUcum: 'Ohm' });
    expect(column(t, 'R').values[0]).toBe(0.0125);
    expect(t.warnings.map((w) => w.code)).toEqual(['unit-symbol-font']);
  });

  it('CR-only line endings', async () => {
    const t = await parseTransportText('T (K),R (Ohm)\r1,10\r2,20\r');
    expect(t.rowCount).toBe(2);
    expect(Array.from(column(t, 'R').values)).toEqual([10, 20]);
  });

  it('a forced encoding wins over detection', async () => {
    const t = await parseTransportText(iconv.encode('T (K),R (Ohm)\n1,2\n', 'utf-8'), { encoding: 'latin1' });
    expect(t.encoding).toBe('latin1');
  });

  it('bytes that are not valid UTF-8 after the sniffed start are replaced and reported', async () => {
    const head = Buffer.from('T (K),R (Ohm)\n' + '1,2\n'.repeat(20000));
    const bad = Buffer.concat([head, Buffer.from([0x33, 0x2c, 0xff, 0x0a])]);
    const t = await parseTransportText(bad);
    expect(t.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['invalid-characters', 'non-numeric-cell']));
  });
});

describe('streaming sources', () => {
  const bytes = fixture('cobalt-ridge-hallbar.dat');

  it('1-byte chunks (CRLF and multi-byte characters split across chunks) give the same result as one buffer', async () => {
    const whole = await parseTransportText(bytes);
    const tiny = await parseTransportTable(bytesFromBuffer(bytes, 1));
    expect(tiny.rowCount).toBe(whole.rowCount);
    expect(tiny.columns.map((c) => Array.from(c.values))).toEqual(whole.columns.map((c) => Array.from(c.values)));
    const utf16 = fixture('utf16-lockin.tsv');
    const odd = await parseTransportTable(bytesFromBuffer(utf16, 3));
    expect(odd.columns.map((c) => c.rawHeader)).toEqual(['Time (s)', 'X (µV)', 'Y (µV)', 'R (µV)', 'Theta (deg)']);
  });

  it('accepts a Node Readable and a web ReadableStream', async () => {
    const fromNode = await parseTransportTable(Readable.from([bytes.subarray(0, 1000), bytes.subarray(1000)]));
    const web = new Blob([bytes]).stream();
    const fromWeb = await parseTransportTable(bytesFromWebStream(web));
    expect(fromNode.rowCount).toBe(181);
    expect(fromWeb.rowCount).toBe(181);
    expect(Array.from(fromWeb.columns[2].values)).toEqual(Array.from(fromNode.columns[2].values));
  });

  it('maxRows stops early for previews and reports progress', async () => {
    const big = 'T (K),R (Ohm)\n' + Array.from({ length: 50_000 }, (_, i) => `${i},${i * 2}`).join('\n');
    const seen: number[] = [];
    const t = await parseTransportTable(bytesFromBuffer(big, 4096), { maxRows: 10, onProgress: (n) => seen.push(n) });
    expect(t).toMatchObject({ rowCount: 10, truncated: true });
    expect(t.warnings.at(-1)).toMatchObject({ code: 'row-limit' });
    expect(Array.from(column(t, 'R').values)).toEqual([0, 2, 4, 6, 8, 10, 12, 14, 16, 18]);
    // Reading stops after the 64 KiB encoding sniff, far short of the whole file.
    expect(seen.at(-1)).toBe(65536);
    expect(big.length).toBeGreaterThan(500_000);
  });

  it('never modifies the bytes it reads', async () => {
    const copy = Uint8Array.from(bytes);
    await parseTransportText(copy);
    expect(Buffer.compare(Buffer.from(copy), bytes)).toBe(0);
  });

  it('stores a 200 000-row stream in typed arrays', async () => {
    async function* rows() {
      yield new TextEncoder().encode('T (K),R (mOhm)\n');
      for (let k = 0; k < 200; k++) {
        let chunk = '';
        for (let i = 0; i < 1000; i++) chunk += `${k * 1000 + i},${(k * 1000 + i) / 8}\n`;
        yield new TextEncoder().encode(chunk);
      }
    }
    const t = await parseTransportTable(rows());
    expect(t.rowCount).toBe(200_000);
    expect(column(t, 'R').values).toBeInstanceOf(Float64Array);
    expect(column(t, 'R').values[199_999]).toBe(199_999 / 8 / 1000);
    expect(column(t, 'T').range).toEqual({ min: 0, max: 199_999 });
  });
});
