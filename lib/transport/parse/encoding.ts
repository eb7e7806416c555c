import iconv from 'iconv-lite';
import { TransportParseError } from './errors';

export type EncodingGuess = { encoding: string; bomLength: number; how: string };

/** Enough bytes to tell text from binary and UTF-8 from a single-byte code page. */
export const SNIFF_BYTES = 64 * 1024;

function utf16FromNuls(sample: Uint8Array): 'utf-16le' | 'utf-16be' | undefined {
  let evenNul = 0;
  let oddNul = 0;
  for (let i = 0; i < sample.length; i++) if (sample[i] === 0) (i % 2 === 0 ? evenNul++ : oddNul++);
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

function looksBinary(sample: Uint8Array): boolean {
  let control = 0;
  for (let i = 0; i < sample.length; i++) {
    const b = sample[i];
    if (b === 0) return true;
    // Tab, LF, VT, FF, CR and the DOS end-of-file mark occur in text; other C0 controls do not.
    if (b < 32 && b !== 9 && b !== 10 && b !== 11 && b !== 12 && b !== 13 && b !== 26) control++;
  }
  return control > Math.max(4, sample.length * 0.005);
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
  if (b0 === 0xff && b1 === 0xfe) return { encoding: 'utf-16le', bomLength: 2, how: 'UTF-16 LE byte-order mark' };
  if (b0 === 0xfe && b1 === 0xff) return { encoding: 'utf-16be', bomLength: 2, how: 'UTF-16 BE byte-order mark' };
  const utf16 = utf16FromNuls(sample);
  if (utf16 && (sample.length % 2 === 0 || !complete) && !utf16HasControls(sample, utf16)) {
    return { encoding: utf16, bomLength: 0, how: 'NUL byte pattern of UTF-16 without a byte-order mark' };
  }
  if (looksBinary(sample)) {
    throw new TransportParseError(
      'binary',
      'This is not a text table: the file contains NUL or control bytes (a binary file?). Export the data as CSV, TSV or plain text.',
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
