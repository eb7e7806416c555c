import iconv from 'iconv-lite';
import { TransportParseError } from './errors';

export type EncodingGuess = { encoding: string; bomLength: number; how: string };

/** Enough bytes to tell text from binary and UTF-8 from a single-byte code page. */
export const SNIFF_BYTES = 64 * 1024;

function utf16FromNuls(sample: Uint8Array): 'utf-16le' | 'utf-16be' | undefined {
  if (sample.indexOf(0) < 0) return undefined; // no NUL at all: not the pattern
  let evenNul = 0;
  let oddNul = 0;
  for (let i = 0; i < sample.length; i++) {
    if (sample[i] !== 0) continue;
    if (i % 2 === 0) evenNul++;
    else oddNul++;
  }
  const pairs = Math.floor(sample.length / 2);
  if (pairs === 0) return undefined;
  // ASCII text in UTF-16: every other byte is NUL (high byte), on the odd side for LE, the even side for BE.
  if (oddNul > 0.6 * pairs && evenNul < 0.05 * pairs) return 'utf-16le';
  if (evenNul > 0.6 * pairs && oddNul < 0.05 * pairs) return 'utf-16be';
  return undefined;
}

// Text in UTF-16 has no C0 controls other than tab, LF, VT, FF and CR: a NUL pattern alone is not enough.
function utf16HasControls(sample: Uint8Array, encoding: 'utf-16le' | 'utf-16be'): boolean {
  const hi = encoding === 'utf-16le' ? 1 : 0;
  for (let i = 0; i + 1 < sample.length; i += 2) {
    const unit = sample[i + hi] * 256 + sample[i + 1 - hi];
    if (unit < 32 && unit !== 9 && unit !== 10 && unit !== 11 && unit !== 12 && unit !== 13) return true;
  }
  return false;
}

/** Index of the first byte that text does not contain (NUL, or one control byte too many), or -1 for text. */
function firstBinaryByte(sample: Uint8Array): number {
  let control = 0;
  let firstControl = -1;
  const allowed = Math.max(4, sample.length * 0.005);
  for (let i = 0; i < sample.length; i++) {
    const b = sample[i];
    if (b === 0) return i;
    // Tab, LF, VT, FF, CR and the DOS end-of-file mark occur in text; other C0 controls do not.
    if (b < 32 && b !== 9 && b !== 10 && b !== 11 && b !== 12 && b !== 13 && b !== 26) {
      if (firstControl < 0) firstControl = i;
      if (++control > allowed) return firstControl;
    }
  }
  return -1;
}

/** 1-based line of sample[index], counting LF (or CR alone) before it. */
function lineOfByte(sample: Uint8Array, index: number): number {
  let lf = 0;
  let cr = 0;
  for (let i = 0; i < index; i++) {
    if (sample[i] === 10) lf++;
    else if (sample[i] === 13) cr++;
  }
  return 1 + (lf > 0 ? lf : cr);
}

// UTF-32 puts three NUL bytes beside every ASCII character; iconv-lite can decode it but transport files never use it.
function utf32Name(sample: Uint8Array): string | undefined {
  const [b0, b1, b2, b3] = sample;
  if (b0 === 0xff && b1 === 0xfe && b2 === 0 && b3 === 0) return 'UTF-32 LE';
  if (b0 === 0 && b1 === 0 && b2 === 0xfe && b3 === 0xff) return 'UTF-32 BE';
  const quads = Math.floor(sample.length / 4);
  if (quads < 4 || sample.indexOf(0) < 0) return undefined; // UTF-32 text is mostly NUL bytes
  let le = 0;
  let be = 0;
  for (let q = 0; q < quads; q++) {
    const a = sample[4 * q];
    const b = sample[4 * q + 1];
    const c = sample[4 * q + 2];
    const d = sample[4 * q + 3];
    if (a !== 0 && b === 0 && c === 0 && d === 0) le++;
    if (a === 0 && b === 0 && c === 0 && d !== 0) be++;
  }
  if (le > 0.9 * quads) return 'UTF-32 LE';
  if (be > 0.9 * quads) return 'UTF-32 BE';
  return undefined;
}

function isValidUtf8(sample: Uint8Array, complete: boolean): boolean {
  let end = sample.length;
  if (!complete) {
    // Do not fail on a multi-byte character cut by the sample's end.
    let back = 0;
    while (back < 3 && end - back - 1 >= 0 && (sample[end - back - 1] & 0xc0) === 0x80) back++;
    const lead = sample[end - back - 1];
    if (lead !== undefined && lead >= 0xc0) end = end - back - 1;
  }
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(sample.subarray(0, end));
    return true;
  } catch {
    return false;
  }
}

/** Encoding of a file from its first bytes: BOM, then the UTF-16 NUL pattern, then UTF-8 validity, else a code page. */
export function detectEncoding(sample: Uint8Array, complete: boolean): EncodingGuess {
  const [b0, b1, b2] = sample;
  if (b0 === 0xef && b1 === 0xbb && b2 === 0xbf) return { encoding: 'utf-8', bomLength: 3, how: 'UTF-8 byte-order mark' };
  const utf32 = utf32Name(sample);
  if (utf32) {
    throw new TransportParseError(
      'unsupported-encoding',
      `The file is ${utf32} text, which Ohmstead does not read. Save it as UTF-8 (or UTF-16, or a single-byte code page).`,
      1,
    );
  }
  if (b0 === 0xff && b1 === 0xfe) return { encoding: 'utf-16le', bomLength: 2, how: 'UTF-16 LE byte-order mark' };
  if (b0 === 0xfe && b1 === 0xff) return { encoding: 'utf-16be', bomLength: 2, how: 'UTF-16 BE byte-order mark' };
  const utf16 = utf16FromNuls(sample);
  if (utf16 && (sample.length % 2 === 0 || !complete) && !utf16HasControls(sample, utf16)) {
    return { encoding: utf16, bomLength: 0, how: 'NUL byte pattern of UTF-16 without a byte-order mark' };
  }
  const binaryAt = firstBinaryByte(sample);
  if (binaryAt >= 0) {
    const line = lineOfByte(sample, binaryAt);
    throw new TransportParseError(
      'binary',
      `This is not a text table: line ${line} contains ${sample[binaryAt] === 0 ? 'a NUL byte' : 'control bytes'} (byte ${binaryAt + 1}; a binary file?). Export the data as CSV, TSV or plain text.`,
      line,
    );
  }
  if (isValidUtf8(sample, complete)) return { encoding: 'utf-8', bomLength: 0, how: 'valid UTF-8' };
  // Bytes 0x80–0x9F are C1 controls in ISO-8859-1 but printable in Windows-1252 (e.g. the euro sign, curly quotes).
  const hasC1 = sample.some((b) => b >= 0x80 && b <= 0x9f);
  return hasC1
    ? { encoding: 'windows-1252', bomLength: 0, how: 'not UTF-8; bytes 0x80–0x9F read as Windows-1252' }
    : { encoding: 'latin1', bomLength: 0, how: 'not UTF-8; read as Latin-1 (ISO-8859-1)' };
}

export type StreamDecoder = { write(bytes: Uint8Array): string; end(): string };

/** A streaming decoder (iconv-lite) that keeps multi-byte characters split across chunks intact. */
export function createDecoder(encoding: string): StreamDecoder {
  if (!iconv.encodingExists(encoding)) {
    throw new TransportParseError('unsupported-encoding', `The text encoding '${encoding}' is not supported.`);
  }
  const decoder = iconv.getDecoder(encoding, { stripBOM: true });
  return {
    // iconv-lite decoders take a Buffer; Buffer.from on a Uint8Array view shares no state with the caller's bytes.
    write: (bytes) => decoder.write(Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength)),
    end: () => decoder.end() ?? '',
  };
}
