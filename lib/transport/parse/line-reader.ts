import { ByteLineSplitter, isAsciiCompatible, lineDecoder, type FastLineSink } from './byte-lines';
import { createDecoder, detectEncoding, SNIFF_BYTES, type StreamDecoder } from './encoding';
import { TransportParseError } from './errors';
import { ParallelRows, type ParallelOptions, type WorkerCrew } from './parallel-rows';
import type { RowFormat } from './plain-rows';
import { readAhead } from './sources';
import type { ByteSource } from './types';

/** Receives s[start, end) as one line (no line break); returns false to stop reading. */
export type TextLineSink = (s: string, start: number, end: number, lineNo: number) => boolean;

/**
 * Where lines go. `bytes` (optional) takes lines of ASCII-compatible encodings undecoded, with `decode` for the lines
 * it wants as text; without it, or for other encodings (UTF-16), every line comes to `text`.
 */
export type LineSink = {
  text: TextLineSink;
  bytes?: (bytes: Uint8Array, start: number, end: number, lineNo: number, decode: (bytes: Uint8Array, start: number, end: number) => string) => boolean;
  /** With `bytes`: takes whole plain lines straight from the chunk (see FastLineSink). */
  fastRows?: FastLineSink;
  /** With `bytes`: asked after each chunk whether to read the rest of the source in parallel (see ParallelRows). */
  parallel?: (bytesRead: number) => ParallelPlan | undefined;
};

/** How to read the rest of a source in parallel: the workers (now the reader's to stop), the row layout, where rows go. */
export type ParallelPlan = {
  crew: WorkerCrew;
  format: RowFormat;
  columns: number;
  appendRows: (columns: Float64Array[], rows: number, stats: Float64Array) => void;
  bytesPerRow: number;
  options: ParallelOptions;
};

export type ReadLinesOptions = {
  encoding?: string;
  maxLineBytes: number;
  maxBytes: number;
  signal?: AbortSignal;
  onProgress?: (bytesRead: number) => void;
};

export type ReadLinesResult = { encoding: string; encodingReason: string; bytesRead: number; replacementChars: boolean; stopped: boolean };

const LF = 10;
const CR = 13;

function concat(parts: Uint8Array[], total: number): Uint8Array {
  if (parts.length === 1) return parts[0];
  const out = new Uint8Array(total);
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}

/** Decodes a byte stream and hands complete lines to `sink`, holding at most one partial line in memory. */
export async function readLines(source: ByteSource, options: ReadLinesOptions, sink: LineSink): Promise<ReadLinesResult> {
  let decoder: StreamDecoder | undefined;
  let encoding = options.encoding ?? '';
  let encodingReason = options.encoding ? 'given by the caller' : '';
  let bytesPerChar = 1;
  let bytesRead = 0;
  let tail = '';
  let lineNo = 1;
  let mode: 'unknown' | 'lf' | 'cr' = 'unknown';
  let first = true;
  let stopped = false;
  let replacementChars = false;
  const sniff: Uint8Array[] = [];
  let sniffLength = 0;
  let splitter: ByteLineSplitter | undefined;

  const feed = (text: string, final: boolean): void => {
    if (first && text.length > 0) {
      if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
      first = false;
    }
    if (!replacementChars && text.includes('\uFFFD')) replacementChars = true;
    const s = tail.length ? tail + text : text;
    if (mode === 'unknown') {
      const lf = s.indexOf('\n');
      const cr = s.indexOf('\r');
      if (lf >= 0) mode = 'lf';
      else if (cr >= 0 && (cr < s.length - 1 || final)) mode = 'cr';
    }
    let p = 0;
    if (mode !== 'unknown') {
      const sep = mode === 'lf' ? LF : CR;
      const sepChar = mode === 'lf' ? '\n' : '\r';
      for (let q = s.indexOf(sepChar, p); q >= 0; q = s.indexOf(sepChar, p)) {
        const end = sep === LF && q > p && s.charCodeAt(q - 1) === CR ? q - 1 : q;
        if (!sink.text(s, p, end, lineNo++)) {
          stopped = true;
          tail = '';
          return;
        }
        p = q + 1;
      }
    }
    tail = p === 0 ? s : s.slice(p);
    if (tail.length * bytesPerChar > options.maxLineBytes) {
      throw new TransportParseError(
        'line-too-long',
        `Line ${lineNo} is longer than ${options.maxLineBytes} bytes without a line break; this is not a table Ohmstead can read line by line.`,
        lineNo,
      );
    }
    if (final && tail.length > 0) {
      if (!sink.text(tail, 0, tail.length, lineNo++)) stopped = true;
      tail = '';
    }
  };

  const startDecoding = (bytes: Uint8Array, complete: boolean) => {
    if (!options.encoding) {
      const guess = detectEncoding(bytes, complete);
      encoding = guess.encoding;
      encodingReason = guess.how;
    }
    decoder = createDecoder(encoding);
    const bytesSink = sink.bytes;
    if (bytesSink && isAsciiCompatible(encoding)) {
      const decode = lineDecoder(encoding, () => (replacementChars = true));
      const utf8 = encoding.toLowerCase().replace(/[-_]/g, '') === 'utf8';
      splitter = new ByteLineSplitter(options.maxLineBytes, utf8, (b, start, end, no) => bytesSink(b, start, end, no, decode), sink.fastRows);
      write(bytes, false);
      return;
    }
    bytesPerChar = encoding.toLowerCase().startsWith('utf-16') || encoding.toLowerCase() === 'ucs2' ? 2 : 1;
    feed(decoder.write(bytes), false);
  };

  const write = (bytes: Uint8Array, final: boolean) => {
    if (splitter) {
      splitter.write(bytes, final);
      stopped = splitter.stopped;
    } else if (decoder) feed(final ? decoder.write(bytes) + decoder.end() : decoder.write(bytes), final);
  };

  // Once the table's rows have a known layout, a large rest of the file may go to ParallelRows instead of the splitter.
  let rows: ParallelRows | undefined;
  const startParallel = (): void => {
    const s = splitter;
    const sep = s?.separator;
    if (!s || sep === undefined || stopped) return;
    const plan = sink.parallel?.(bytesRead); // one plan per table: once refused or taken, undefined from then on
    if (!plan) return;
    const partial = s.takePartial();
    try {
      const target = {
        format: plan.format,
        columns: plan.columns,
        appendRows: plan.appendRows,
        writeLines: (bytes: Uint8Array) => s.write(bytes, false),
        countLines: (lines: number) => void (s.lineNo += lines),
        end: (bytes: Uint8Array) => s.write(bytes, true),
      };
      rows = new ParallelRows(plan.crew, target, sep, options.maxLineBytes, plan.options, plan.bytesPerRow, partial);
    } catch (error) {
      plan.crew.stop();
      if (!(error instanceof RangeError)) throw error; // a bug, not a shortage: do not hide it behind a slower read
      s.write(partial, false); // no shared memory to be had: the partial line goes back and the read goes on here
    }
  };

  try {
    try {
      for await (const chunk of readAhead(source)) {
        if (options.signal?.aborted) throw new TransportParseError('aborted', 'Reading the file was cancelled.');
        bytesRead += chunk.length;
        if (bytesRead > options.maxBytes) {
          await rows?.settle(); // every complete line in, so the line number is the sequential read's
          const line = splitter ? splitter.lineNo : lineNo;
          throw new TransportParseError('too-large', `The file is over the configured size limit of ${options.maxBytes} bytes (reading stopped in line ${line}).`, line);
        }
        if (!decoder) {
          sniff.push(chunk);
          sniffLength += chunk.length;
          if (sniffLength >= SNIFF_BYTES) startDecoding(concat(sniff, sniffLength), false);
        } else if (rows) await rows.write(chunk, false);
        else write(chunk, false);
        if (!rows && sink.parallel) startParallel();
        options.onProgress?.(bytesRead);
        if (stopped) break;
      }
    } catch (e) {
      if (e instanceof TransportParseError) throw e;
      throw new TransportParseError('read-failed', `The file could not be read: ${e instanceof Error ? e.message : String(e)}`);
    }
    if (bytesRead === 0) throw new TransportParseError('empty', 'The file is empty: line 1 has no bytes at all.', 1);
    if (!stopped) {
      if (!decoder) startDecoding(concat(sniff, sniffLength), true);
      if (rows) await rows.write(new Uint8Array(0), true);
      else if (!stopped) write(new Uint8Array(0), true);
    }
  } finally {
    rows?.close();
  }
  return { encoding, encodingReason, bytesRead, replacementChars, stopped: stopped || Boolean(splitter?.stopped) };
}
