import iconv from 'iconv-lite';
import { describe, expect, it } from 'vitest';
import { parseTransportText } from '@/lib/transport/parse';
import { column, fixture, parseError } from './helpers';

describe('bad input gives a typed error, never a crash', () => {
  it('empty file', async () => {
    expect(await parseError(fixture('empty.csv'))).toMatchObject({ name: 'TransportParseError', code: 'empty', line: 1, message: 'The file is empty: line 1 has no bytes at all.' });
  });

  it('only blank lines', async () => {
    expect(await parseError('\n  \r\n\t\n')).toMatchObject({ code: 'empty', line: 3, message: 'The file contains no text, only blank lines (lines 1–3).' });
  });

  it('header without data rows names the header line', async () => {
    expect(await parseError(fixture('header-only.csv'))).toMatchObject({ code: 'no-data', line: 1, message: 'The file has a header (line 1) but no rows of numbers.' });
    expect(await parseError('# Larkspur Cryogenic Lab\n# Sample: LCL-Nb-02\n\nT (K),R (Ohm)\n\n')).toMatchObject({ code: 'no-data', line: 4 });
  });

  it('only comments and metadata', async () => {
    expect(await parseError('# Sample: A\n# Operator: B\n')).toMatchObject({ code: 'no-data', line: 2, message: 'The file has no rows of numbers (only comments or metadata, lines 1–2).' });
  });

  it('binary data (a PNG signature and random bytes) is refused, naming the line of the first NUL', async () => {
    const bytes = new Uint8Array(4096);
    bytes.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    let seed = 7;
    for (let i = 12; i < bytes.length; i++) bytes[i] = seed = (seed * 1103515245 + 12345) % 256;
    // The PNG signature holds two LF bytes before the first NUL (byte 9): line 3.
    expect(await parseError(bytes)).toMatchObject({
      code: 'binary',
      line: 3,
      message: 'This is not a text table: line 3 contains a NUL byte (byte 9; a binary file?). Export the data as CSV, TSV or plain text.',
    });
  });

  it('text with stray control bytes is refused as binary, a single NUL too, each with its line', async () => {
    const text = 'T,R\n' + '1,2\x01\x02\x03\x04\x05\x06\n'.repeat(20);
    expect(await parseError(text)).toMatchObject({ code: 'binary', line: 2, message: expect.stringContaining('line 2 contains control bytes (byte 8;') });
    expect(await parseError('T,R\n1,2\n\0')).toMatchObject({ code: 'binary', line: 3 });
  });

  it('UTF-32 text (with or without a byte-order mark) is an unsupported encoding, not binary', async () => {
    const table = 'T (K),R (Ohm)\n1,10\n2,20\n';
    expect(await parseError(iconv.encode(table, 'utf-32le', { addBOM: true }))).toMatchObject({
      code: 'unsupported-encoding',
      line: 1,
      message: 'The file is UTF-32 LE text, which Ohmstead does not read. Save it as UTF-8 (or UTF-16, or a single-byte code page).',
    });
    expect(await parseError(iconv.encode(table, 'utf-32be', { addBOM: false }))).toMatchObject({ code: 'unsupported-encoding', message: expect.stringMatching(/^The file is UTF-32 BE text/) });
  });

  it('a 10 MB line without a break stops at maxLineBytes with the line number', async () => {
    const huge = 'T,R\n1,2\n' + '9'.repeat(10 * 1024 * 1024);
    const e = await parseError(huge);
    expect(e).toMatchObject({ code: 'line-too-long', line: 3 });
    expect(e.message).toBe('Line 3 is longer than 1048576 bytes without a line break; this is not a table Ohmstead can read line by line.');
    expect(await parseError('T,R\n' + 'x'.repeat(5000), { maxLineBytes: 4096 })).toMatchObject({ code: 'line-too-long', line: 2 });
  });

  it('a 10 MB first line (no break at all), in UTF-8 and in UTF-16, stops at line 1', async () => {
    const line = '1,'.repeat(5 * 1024 * 1024);
    expect(await parseError(line)).toMatchObject({ code: 'line-too-long', line: 1 });
    expect(await parseError(iconv.encode(`T,R\n1,2\n${line}`, 'utf-16le', { addBOM: true }))).toMatchObject({ code: 'line-too-long', line: 3 });
  });

  it('a file over maxBytes', async () => {
    const text = 'T,R\n' + '1,2\n'.repeat(100_000);
    // Bytes arrive in 64 KiB chunks: the second chunk passes the limit after 65 536 bytes = line 1 + 16 383 rows of 4 bytes.
    expect(await parseError(text, { maxBytes: 100_000 })).toMatchObject({
      code: 'too-large',
      line: 16_385,
      message: 'The file is over the configured size limit of 100000 bytes (reading stopped in line 16385).',
    });
  });

  it('an encoding iconv-lite does not know', async () => {
    expect(await parseError('T,R\n1,2\n', { encoding: 'klingon-8' })).toMatchObject({ code: 'unsupported-encoding', message: "The text encoding 'klingon-8' is not supported." });
  });

  it('a cancelled read', async () => {
    const controller = new AbortController();
    controller.abort();
    expect(await parseError('T,R\n1,2\n', { signal: controller.signal })).toMatchObject({ code: 'aborted' });
  });

  it('non-numeric cells become NaN with a warning naming line and column', async () => {
    const t = await parseTransportText('T (K),R (Ohm)\n1,10\n2,ten\n3,30\n');
    expect(Array.from(column(t, 'R').values)).toEqual([10, NaN, 30]);
    expect(t.warnings).toEqual([{ line: 3, code: 'non-numeric-cell', column: 'R', message: "Line 3, column 'R': 'ten' is not a number; it is stored as NaN." }]);
  });

  it('a row of text inside the data is skipped with a warning', async () => {
    const t = await parseTransportText('T,R\n1,10\n2,20\nend of run,\n3,30\n');
    expect(t.rowCount).toBe(3);
    expect(t.warnings.filter((w) => w.code !== 'unit-assumed')).toEqual([{ line: 4, code: 'text-row', message: "Line 4 has no numbers ('end of run,'); the row is skipped." }]);
  });

  it('unknown units leave the values unconverted and say so', async () => {
    const t = await parseTransportText('T (K),R (furlongs)\n1,10\n2,20\n');
    expect(column(t, 'R')).toMatchObject({ quantity: 'resistance', ucum: null, siUcum: null, converted: false });
    expect(Array.from(column(t, 'R').values)).toEqual([10, 20]);
    expect(t.warnings).toEqual([
      { line: 1, code: 'unit-unknown', column: 'R', message: "Column 'R': unit 'furlongs' is not recognised; values are left as in the file and marked unconverted." },
    ]);
  });

  it('a missing unit is assumed only with a warning; resistivity is never assumed', async () => {
    const t = await parseTransportText('T,rho\n1,10\n2,20\n');
    expect(column(t, 'T')).toMatchObject({ ucum: 'K', converted: true });
    expect(column(t, 'rho')).toMatchObject({ quantity: 'resistivity', ucum: null, converted: false });
    expect(t.warnings.map((w) => w.code)).toEqual(['unit-assumed', 'unit-missing']);
  });

  it('warnings of one kind are capped, with a count of the rest', async () => {
    const rows = Array.from({ length: 100 }, (_, i) => `${i},x`).join('\n');
    const t = await parseTransportText(`T (K),R (Ohm),V (V)\n0,1,2\n1,2,3\n${rows.replace(/,x/g, ',x,1')}\n`);
    const nonNumeric = t.warnings.filter((w) => w.code === 'non-numeric-cell');
    expect(nonNumeric).toHaveLength(20);
    expect(t.warnings.find((w) => w.code === 'more-warnings')).toEqual({ line: 24, code: 'more-warnings', message: "80 more 'non-numeric-cell' warnings (100 in all), the first of them on line 24." });
  });
});
