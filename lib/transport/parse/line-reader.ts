import { createDecoder, detectEncoding, SNIFF_BYTES, type StreamDecoder } from './encoding';
import { TransportParseError } from './errors';
import type { ByteSource } from './types';

/** Receives s[start, end) as one line (no line break); returns false to stop reading. */
export type LineSink = (s: string, start: number, end: number, lineNo: number) => boolean;

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
        if (!sink(s, p, end, lineNo++)) {
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
      if (!sink(tail, 0, tail.length, lineNo++)) stopped = true;
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
    bytesPerChar = encoding.toLowerCase().startsWith('utf-16') || encoding.toLowerCase() === 'ucs2' ? 2 : 1;
    feed(decoder.write(bytes), false);
  };

  try {
    for await (const chunk of source) {
      if (options.signal?.aborted) throw new TransportParseError('aborted', 'Reading the file was cancelled.');
      bytesRead += chunk.length;
      if (bytesRead > options.maxBytes) {
        throw new TransportParseError('too-large', `The file is over the configured size limit of ${options.maxBytes} bytes.`);
      }
      if (!decoder) {
        sniff.push(chunk);
        sniffLength += chunk.length;
        if (sniffLength >= SNIFF_BYTES) startDecoding(concat(sniff, sniffLength), false);
      } else feed(decoder.write(chunk), false);
      options.onProgress?.(bytesRead);
      if (stopped) break;
    }
  } catch (e) {
    if (e instanceof TransportParseError) throw e;
    throw new TransportParseError('read-failed', `The file could not be read: ${e instanceof Error ? e.message : String(e)}`);
  }
  if (bytesRead === 0) throw new TransportParseError('empty', 'The file is empty.');
  if (!stopped) {
    if (!decoder) startDecoding(concat(sniff, sniffLength), true);
    if (!stopped && decoder) feed(decoder.end(), true);
  }
  return { encoding, encodingReason, bytesRead, replacementChars, stopped };
}
