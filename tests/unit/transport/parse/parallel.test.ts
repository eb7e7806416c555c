import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { bytesFromBuffer, parseTransportTable, type ParsedTable, type ParseOptions } from '@/lib/transport/parse';
import { idleCores, type ParallelStats } from '@/lib/transport/parse/parallel-rows';
import { summariseFile } from '@/lib/transport/summarise-file';
import { seededRandom } from '../physics/seeded-random';
import { FIXTURES } from './helpers';

// Large files are read by worker threads as well as the main thread (ParallelRows). The result must not depend on it:
// every column bit for bit, every warning with its line number, every error, the same as the sequential read.

type Outcome = { table?: ParsedTable; error?: { name: string; code?: string; line?: number; message: string } };

async function outcome(run: Promise<ParsedTable>): Promise<Outcome> {
  try {
    return { table: await run };
  } catch (e) {
    const err = e as { name: string; code?: string; line?: number; message: string };
    return { error: { name: err.name, code: err.code, line: err.line, message: err.message } };
  }
}

/** Values as their IEEE bit patterns, so −0 ≠ 0 and every NaN compares equal. */
const bits = (values: Float64Array) => Array.from(new BigUint64Array(Float64Array.from(values, (v) => (Number.isNaN(v) ? NaN : v)).buffer), String);

function comparable(o: Outcome) {
  if (!o.table) return o;
  const { columns, ...rest } = o.table;
  return { ...rest, columns: columns.map(({ values, ...c }) => ({ ...c, length: values.length, bits: bits(values) })) };
}

/**
 * Parses `bytes` sequentially and with workers on 1 KiB segments, once with the workers reading every segment sent to
 * them and once with the main thread taking back the ones they have not started; expects identical outcomes.
 */
async function expectSameInParallel(bytes: Uint8Array, options: ParseOptions = {}, chunk = 4096, workers = 1) {
  const sequential = await outcome(parseTransportTable(bytesFromBuffer(bytes, chunk), { ...options, parallel: false }));
  let stats: ParallelStats | undefined;
  const parallel = await outcome(
    parseTransportTable(bytesFromBuffer(bytes, chunk), { ...options, parallel: { minBytes: 0, minIdleCores: 0, segmentBytes: 1024, workers, steal: false, report: (s) => (stats = s) } }),
  );
  expect(comparable(parallel)).toEqual(comparable(sequential));
  const stealing = await outcome(parseTransportTable(bytesFromBuffer(bytes, chunk), { ...options, parallel: { minBytes: 0, minIdleCores: 0, segmentBytes: 1024, workers } }));
  expect(comparable(stealing)).toEqual(comparable(sequential));
  return { sequential, parallel, stats: stats as ParallelStats | undefined };
}

const latin1 = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1');

/** The fixture with its data lines (from the first data line on) repeated until it is at least `size` bytes. */
function enlarged(bytes: Uint8Array, firstDataLine: number, size = 200_000): Uint8Array {
  const text = latin1(bytes);
  const eol = text.includes('\r\n') ? '\r\n' : text.includes('\n') ? '\n' : '\r';
  const lines = text.split(eol);
  const ended = lines[lines.length - 1] === '';
  if (ended) lines.pop();
  const head = lines.slice(0, firstDataLine - 1);
  const data = lines.slice(firstDataLine - 1);
  const out = [...head];
  let length = text.length;
  while (length < size) {
    out.push(...data);
    length += data.join(eol).length;
  }
  return Buffer.from(out.join(eol) + (ended ? eol : ''), 'latin1');
}

/** The bytes in 4 kB chunks, one every 5 ms: a source that takes longer than the 60 ms the free cores are measured over. */
function slowly(bytes: Uint8Array): AsyncIterable<Uint8Array> {
  return {
    async *[Symbol.asyncIterator]() {
      for (let i = 0; i < bytes.length; i += 4096) {
        await new Promise((resolve) => setTimeout(resolve, 5));
        yield bytes.subarray(i, i + 4096);
      }
    },
  };
}

const FIXTURE_FILES = readdirSync(FIXTURES).filter((f) => !f.endsWith('.ts') && !f.endsWith('.json'));

describe('parallel read == sequential read', () => {
  it.each(FIXTURE_FILES)('%s, as it is and with its data repeated to 200 kB', async (name) => {
    const bytes = new Uint8Array(readFileSync(path.join(FIXTURES, name)));
    const { sequential } = await expectSameInParallel(bytes, {}, 512);
    const t = sequential.table;
    if (!t) return; // the error was the same
    const big = enlarged(bytes, t.firstDataLine);
    const { sequential: bigSequential, stats } = await expectSameInParallel(big, {}, 4096);
    expect(bigSequential.table?.rowCount).toBeGreaterThan(t.rowCount);
    // Files in ASCII-compatible encodings are read by the worker; UTF-16 always takes the text path.
    if (t.encoding === 'utf-16le' || t.encoding === 'utf-16be') expect(stats).toBeUndefined();
    else expect(stats?.workerSegments).toBeGreaterThan(0);
  });

  it.each(FIXTURE_FILES.filter((f) => readdirSync(FIXTURES).includes(f.replace(/\.[^.]+$/, '.meta.json'))))(
    'summariseFile on %s (repeated, with its metadata) gives the same summary',
    async (name) => {
      const bytes = new Uint8Array(readFileSync(path.join(FIXTURES, name)));
      const metadata = JSON.parse(readFileSync(path.join(FIXTURES, name.replace(/\.[^.]+$/, '.meta.json')), 'utf8'));
      const first = await parseTransportTable(bytesFromBuffer(bytes), { parallel: false });
      const big = enlarged(bytes, first.firstDataLine);
      const sequential = await summariseFile(bytesFromBuffer(big), { metadata, fileName: name, parallel: false });
      const parallel = await summariseFile(bytesFromBuffer(big), { metadata, fileName: name, parallel: { minBytes: 0, minIdleCores: 0, segmentBytes: 2048 } });
      expect(parallel).toEqual(sequential);
      expect(sequential.rowCount).toBeGreaterThan(first.rowCount);
    },
  );

  it('odd lines on segment boundaries: comments, text rows, short and long rows, quotes, NaN, µ, stray CR; LF, CRLF and CR', async () => {
    const odd = ['# a comment', '2,ten,5', 'end of run', '3,30', '4,40,5,99', '5,50\r,5', '6,60 µ,5', '', '7,"70",5', '8,NaN,-', ' 9 , 90 , 5 ', '10,1e400,-0'];
    const random = seededRandom(7);
    const lines = ['# Larkspur Cryogenic Lab, cooldown 9', 'T (K),R (mOhm),I (uA)'];
    for (let i = 0; i < 6000; i++) {
      lines.push(random() < 0.03 ? odd[Math.floor(random() * odd.length)] : `${(i * 0.01).toFixed(2)},${(100 + random()).toFixed(6)},10`);
    }
    for (const eol of ['\n', '\r\n', '\r']) {
      const bytes = new TextEncoder().encode(lines.join(eol) + eol);
      for (const chunk of [4096, 333]) {
        const { sequential, stats } = await expectSameInParallel(bytes, {}, chunk);
        expect(sequential.table?.warnings.length).toBeGreaterThan(20);
        expect(stats?.workerSegments).toBeGreaterThan(0);
      }
    }
  });

  it('whitespace and ";" layouts, long mantissas (Number() on the text), exponents and decimal prefixes, two workers', async () => {
    const random = seededRandom(11);
    const formats: ((v: number) => string)[] = [(v) => String(v), (v) => v.toExponential(18), (v) => v.toPrecision(17), (v) => v.toFixed(3)];
    const cell = () => formats[Math.floor(random() * formats.length)]((random() - 0.4) * 10 ** (Math.floor(random() * 30) - 15));
    const ws = ['B (Oe)   Rxx (mOhm)   V (nV)', ...Array.from({ length: 5000 }, () => `  ${cell()}   ${cell()}\t${cell()}`)];
    const { stats } = await expectSameInParallel(new TextEncoder().encode(ws.join('\n') + '\n'), {}, 4096, 2);
    expect(stats?.workers).toBe(2);
    const semicolon = ['T (K);R (Ohm)', ...Array.from({ length: 5000 }, () => `${cell()};${cell()}`.replace(/\./g, ','))];
    await expectSameInParallel(new TextEncoder().encode(semicolon.join('\n') + '\n'));
  });

  it('the same errors with the same line numbers: a line over the limit, a file over the size limit', async () => {
    const rows = Array.from({ length: 10_000 }, (_, i) => `${i},${i * 2}`); // past the first 64 kB read to detect the encoding
    const long = ['a (s),b (V)', ...rows, `1,${'9'.repeat(5000)}`, ...rows].join('\n') + '\n';
    // The limit applies to the line held between chunks, so the chunks are smaller than the limit.
    const tooLong = await expectSameInParallel(new TextEncoder().encode(long), { maxLineBytes: 3000 }, 1000);
    expect(tooLong.parallel.error).toMatchObject({ code: 'line-too-long', line: 10_002 });
    const tooLarge = await expectSameInParallel(new TextEncoder().encode(['a (s),b (V)', ...rows, ...rows].join('\n')), { maxBytes: 150_000 });
    expect(tooLarge.parallel.error?.code).toBe('too-large');
  });

  it('column statistics kept while reading: the first of equal values (0 before −0), no ±Infinity, NaN counted', async () => {
    const lines = ['a (V),b (V),c (V)'];
    for (let i = 0; i < 6000; i++) lines.push(i === 4000 ? '1e400,-inf,NaN' : i % 2 ? `0,-0,${i}` : `-0,0,${-i}`);
    const bytes = new TextEncoder().encode(lines.join('\n') + '\n');
    const { sequential } = await expectSameInParallel(bytes);
    const t = sequential.table as ParsedTable;
    // The range as a plain pass over the values gives it: NaN counted, ±Infinity skipped, strict < and > (common practice).
    for (const c of t.columns) {
      let [min, max, nan] = [Infinity, -Infinity, 0];
      for (const v of c.values) {
        if (Number.isNaN(v)) nan++;
        else if (Number.isFinite(v)) [min, max] = [v < min ? v : min, v > max ? v : max];
      }
      expect(c.nanCount).toBe(nan);
      expect(Object.is(c.range?.min, min) && Object.is(c.range?.max, max), `column ${c.name}`).toBe(true);
    }
    expect(Object.is(t.columns[0].range?.min, -0)).toBe(true); // the first a is −0
    expect(Object.is(t.columns[1].range?.max, 0)).toBe(true); // the first b is 0
    expect(t.columns[2]).toMatchObject({ nanCount: 1, range: { min: -5998, max: 5999 } });
  });

  it('small files and row limits stay on the calling thread', async () => {
    const text = ['T (K),R (Ohm)', ...Array.from({ length: 20_000 }, (_, i) => `${i},${i}`)].join('\n') + '\n';
    const bytes = new TextEncoder().encode(text);
    let reports = 0;
    const report = () => void reports++;
    // Under the default 8 MiB threshold, with a row limit, and with parallel: false no worker starts.
    await parseTransportTable(bytesFromBuffer(bytes), { sizeBytes: bytes.length, parallel: { report } });
    await parseTransportTable(bytesFromBuffer(bytes), { maxRows: 15_000, parallel: { minBytes: 0, minIdleCores: 0, report } });
    expect(reports).toBe(0);
    // Without a size the threshold applies to the bytes read so far.
    await parseTransportTable(bytesFromBuffer(bytes), { parallel: { minBytes: 100_000, minIdleCores: 0, report } });
    expect(reports).toBe(1);
    // Workers start only when the machine had idle cores while reading began; no machine has 4096 of them idle.
    await parseTransportTable(slowly(bytes), { parallel: { minBytes: 0, minIdleCores: 4096, report } });
    expect(reports).toBe(1);
  });

  it('free cores between two samples: idle time plus this process\'s own CPU time, per wall time, less the main thread', () => {
    // 100 ms: the process used 130 ms of CPU (main thread 100, its file reads and compiler 30), the machine was idle
    // 70 ms (the second core, the rest of the time): nothing else ran, so one core was free for a worker.
    expect(idleCores({ atMs: 1000, idleMs: 52_000, ownMs: 400 }, { atMs: 1100, idleMs: 52_070, ownMs: 530 })).toBeCloseTo(1, 12);
    // Another process kept the second core busy: no idle time, the process used only its main thread.
    expect(idleCores({ atMs: 1000, idleMs: 52_000, ownMs: 400 }, { atMs: 1100, idleMs: 52_000, ownMs: 500 })).toBe(0);
  });
});
