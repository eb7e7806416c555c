import iconv from 'iconv-lite';
import { describe, expect, it } from 'vitest';
import { bytesFromBuffer, parseTransportTable, parseTransportText, type ParsedTable } from '@/lib/transport/parse';
import { seededRandom } from '../physics/seeded-random';
import { column } from './helpers';

// UTF-8 and Latin-1 rows are read straight from the bytes (readPlainRows); UTF-16 text always takes the string path
// (NumberReader). The same table in both encodings must give identical tables, bit for bit and warning for warning.

function comparable(t: ParsedTable) {
  return {
    rowCount: t.rowCount,
    delimiter: t.delimiter,
    decimalSeparator: t.decimalSeparator,
    headerLine: t.headerLine,
    firstDataLine: t.firstDataLine,
    headerMetadata: t.headerMetadata,
    warnings: t.warnings,
    columns: t.columns.map((c) => ({ name: c.name, quantity: c.quantity, ucum: c.ucum, siUcum: c.siUcum, nanCount: c.nanCount, range: c.range })),
  };
}

/** 25 plain rows after the header, so the layout is settled (20-row run) and the rows after them take the fast path. */
function settled(header: string, rows: string[], delimiter = ','): string[] {
  const width = header.split(delimiter === ' ' ? /\s+/ : delimiter).length;
  const plain = Array.from({ length: 25 }, (_, i) => Array.from({ length: width }, (_, k) => String(100 * k + i + 0.5)).join(delimiter));
  return [header, ...plain, ...rows];
}

/** Values as their IEEE bit patterns, so −0 ≠ 0 and every NaN compares equal. */
const bits = (values: Float64Array) => Array.from(new BigUint64Array(Float64Array.from(values, (v) => (Number.isNaN(v) ? NaN : v)).buffer), String);

async function expectSameBothWays(text: string, chunkSizes = [65536]): Promise<ParsedTable> {
  const viaText = await parseTransportText(iconv.encode(text, 'utf-16le', { addBOM: true }));
  expect(viaText.encoding).toBe('utf-16le');
  for (const size of chunkSizes) {
    const viaBytes = await parseTransportTable(bytesFromBuffer(new TextEncoder().encode(text), size));
    expect(viaBytes.encoding).toBe('utf-8');
    expect(comparable(viaBytes)).toEqual(comparable(viaText));
    viaBytes.columns.forEach((c, k) => expect(bits(c.values), `column ${c.name}, chunks of ${size}`).toEqual(bits(viaText.columns[k].values)));
  }
  return viaText;
}

describe('byte fast path agrees with the text path', () => {
  it('awkward but valid cells: blanks, signs, exponents, 16–20 digit mantissas, -0, inf, missing markers, quotes', async () => {
    const rows = settled('T (K),R (mOhm),V (uV),B (Oe),I (A)', [
      '  1.5 ,  +2.25e1,-3E-2,100,0',
      '2,-0,.5,5.,"7"',
      '3,1.2345678901234567,9007199254740993,9007199254740991,1e400',
      '4,0.000000000000000000000001,12345678901234567890,1e-30,-inf',
      '5,NaN,--,,N/A',
      '6,1.5,2.5,3.5,4.5,',
      '7,1e+5,1E5,001.000,0.1000000000000000055511151231257827',
      '8,1,2,3,',
    ]);
    const t = await expectSameBothWays(rows.join('\n') + '\n', [65536, 1, 7]);
    expect(t.rowCount).toBe(33);
    expect(t.warnings).toEqual([]);
    // Spot values against Number(): mΩ and µV are scaled in the exponent (exact decimal shifts), Oe → T by 1e-4.
    expect(column(t, 'R').values[25]).toBe(0.0225);
    expect(Object.is(column(t, 'R').values[26], -0)).toBe(true);
    expect(column(t, 'V').values[27]).toBe(Number('9007199254740993e-6'));
    expect(column(t, 'I').values[27]).toBe(Infinity);
    expect(column(t, 'I').values[31]).toBe(0.1);
    expect(column(t, 'I').values[32]).toBeNaN(); // '8,1,2,3,': the fifth cell is blank, not a trailing delimiter
  });

  it('rows the fast path hands back: comments, text rows, non-numeric cells, short and long rows, stray CR, µ in a cell', async () => {
    const rows = settled('T (K)\tR (Ohm)\tI (uA)', [
      '1\t10\t5',
      '# a comment inside the data',
      '2\tten\t5',
      'end of run',
      '3\t30',
      '4\t40\t5\t99',
      '5\t50\r\t5',
      '6\t60 µ\t5',
      '',
      '7\t70\t5',
    ], '\t');
    const t = await expectSameBothWays(['# Larkspur Cryogenic Lab, cooldown 3', ...rows].join('\r\n') + '\r\n', [65536, 3]);
    // Lines: 1 comment, 2 header, 3–27 plain rows, then the rows above from line 28; the long row is skipped.
    expect(t.rowCount).toBe(25 + 6);
    expect(t.warnings.map((w) => [w.line, w.code])).toEqual([
      [30, 'non-numeric-cell'],
      [31, 'text-row'],
      [32, 'short-row'],
      [33, 'long-row'],
      [34, 'non-numeric-cell'],
      [35, 'non-numeric-cell'],
    ]);
  });

  it('whitespace columns, decimal commas with ";", CR-only line ends, a final line without a break', async () => {
    const ws = settled('Field (Oe)    Rxx (Ohm)', ['  -90000   45.6', '\t0  \t 45.3  ', '90000 45.6'], ' ');
    expect((await expectSameBothWays(ws.join('\n'), [65536, 2])).rowCount).toBe(28);
    const semicolon = settled('T (K);R (Ohm)', ['4,2;1,021', '300;2,5;'], ';').map((l) => l.replace(/\.(?=\d)/g, ','));
    const t = await expectSameBothWays(semicolon.join('\n') + '\n', [65536, 5]);
    expect(t.decimalSeparator).toBe(',');
    expect(column(t, 'R').values[26]).toBe(2.5);
    expect((await expectSameBothWays(settled('T (K),R (Ohm)', ['1,10', '2,20', '3,30']).join('\r'), [65536, 4])).rowCount).toBe(28);
  });

  it('random tables in many number formats and units give identical bits (seeded property test)', async () => {
    const random = seededRandom(20261202);
    const formats: ((v: number) => string)[] = [
      (v) => String(v),
      (v) => v.toFixed(Math.floor(random() * 9)),
      (v) => v.toExponential(Math.floor(random() * 12)),
      (v) => v.toPrecision(1 + Math.floor(random() * 17)),
      (v) => v.toPrecision(17).toUpperCase(),
    ];
    for (let trial = 0; trial < 8; trial++) {
      const header = 'T (K),R (mOhm),rho (uOhm cm),B (Oe),Tset (°C),V (nV)';
      const lines = [header];
      for (let r = 0; r < 400; r++) {
        const cells = Array.from({ length: 6 }, () => {
          const magnitude = 10 ** (Math.floor(random() * 40) - 20);
          const v = (random() - 0.3) * magnitude;
          return formats[Math.floor(random() * formats.length)](v);
        });
        lines.push(cells.join(','));
      }
      const t = await expectSameBothWays(lines.join('\n') + '\n', [65536, 997]);
      expect(t.rowCount).toBe(400);
      expect(t.warnings).toEqual([]);
    }
  });

  it('a plain Clinger-range cell equals Number() of its text', async () => {
    const cells = ['0.1', '123456.789', '-0.000123', '9007199254740991', '4.35e-7', '1.7976931348623157e21'];
    const t = await parseTransportText(`a,b\n${cells.map((c) => `${c},1`).join('\n')}\n`);
    expect(Array.from(column(t, 'a').values)).toEqual(cells.map(Number));
  });
});

describe('column blocks and read-ahead', () => {
  const rows = Array.from({ length: 30_000 }, (_, i) => `${i},${(i * 0.125).toFixed(3)},${i % 7}`);
  const text = `T (K),R (mOhm),n (1)\n${rows.join('\n')}\n`;
  const bytes = new TextEncoder().encode(text);

  it.each([
    ['no size hint (blocks grow from 4096 rows)', undefined],
    ['the exact size (one block)', bytes.length],
    ['a size 10× too small (blocks grow after the estimate)', Math.floor(bytes.length / 10)],
    ['a size 20× too large (the block is trimmed)', bytes.length * 20],
  ])('%s gives the same columns', async (_, sizeBytes) => {
    const t = await parseTransportTable(bytesFromBuffer(bytes, 4096), { sizeBytes });
    expect(t.rowCount).toBe(30_000);
    expect(column(t, 'T').values).toHaveLength(30_000);
    expect(column(t, 'T').values[29_999]).toBe(29_999);
    expect(column(t, 'R').values[29_999]).toBe(3.749875); // 3749.875 mΩ
    expect(column(t, 'R').range).toEqual({ min: 0, max: 3.749875 });
  });

  it('a source error while the next chunk is read ahead is a read-failed error; an early stop closes the source', async () => {
    let closed = 0;
    const failing = {
      async *[Symbol.asyncIterator]() {
        yield bytes.subarray(0, 70_000);
        throw new Error('connection reset');
      },
    };
    await expect(parseTransportTable(failing)).rejects.toMatchObject({ code: 'read-failed', message: 'The file could not be read: connection reset' });
    const endless = {
      async *[Symbol.asyncIterator]() {
        try {
          for (let i = 0; ; i = (i + 65_536) % (bytes.length - 65_536)) yield bytes.slice(i, i + 65_536);
        } finally {
          closed++;
        }
      },
    };
    const t = await parseTransportTable(endless, { maxRows: 100 });
    expect(t).toMatchObject({ rowCount: 100, truncated: true });
    expect(closed).toBe(1);
  });
});
