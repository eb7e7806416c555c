import iconv from 'iconv-lite';
import { TransportParseError } from './errors';

const LF = 10;
const CR = 13;

/**
 * Receives bytes[start, end) as one line (no line break); returns false to stop reading. bytes[end] always exists and is
 * a CR or LF byte, so a reader may look one byte past the line without a bounds check.
 */
export type ByteLineSink = (bytes: Uint8Array, start: number, end: number, lineNo: number) => boolean;

/**
 * Optional fast path: `take` reads whole lines from bytes[start] on (finding their ends itself), among the lines that
 * start at or before `last`, the index of the chunk's last line break `sep`; it returns how many it took and sets `next`
 * to where the first line it did not take starts. That line then goes to the ByteLineSink as usual.
 */
export interface FastLineSink {
  take(bytes: Uint8Array, start: number, last: number, sep: number): number;
  readonly next: number;
}

// In these encodings bytes below 0x80 are ASCII and 0x0A/0x0D never occur inside a multi-byte character, so lines can
// be split (and plain numeric rows read) on the raw bytes without decoding them first.
const ASCII_COMPATIBLE = new Set(['utf8', 'latin1', 'iso88591', 'windows1252', 'cp1252', 'ascii', 'usascii', 'binary']);

export function isAsciiCompatible(encoding: string): boolean {
  return ASCII_COMPATIBLE.has(encoding.toLowerCase().replace(/[-_]/g, ''));
}

const ascii = new TextDecoder('utf-8');

/** A line decoder for an ASCII-compatible encoding: ASCII lines through TextDecoder, others through iconv-lite. */
export function lineDecoder(encoding: string, onReplacement: () => void): (bytes: Uint8Array, start: number, end: number) => string {
  return (bytes, start, end) => {
    let high = false;
    for (let i = start; i < end; i++) {
      if (bytes[i] >= 0x80) {
        high = true;
        break;
      }
    }
    if (!high) return ascii.decode(bytes.subarray(start, end));
    const text = iconv.decode(Buffer.from(bytes.buffer, bytes.byteOffset + start, end - start), encoding, { stripBOM: false });
    if (text.includes('\uFFFD')) onReplacement();
    return text;
  };
}

/** The parts joined, followed by one LF byte that is not part of the line (see ByteLineSink). */
function joinWithBreak(parts: Uint8Array[], total: number): Uint8Array {
  const out = new Uint8Array(total + 1);
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  out[total] = LF;
  return out;
}

/**
 * Splits a byte stream into lines the way the text path does (LF or CRLF, else CR alone; the mode is fixed by the first
 * break), holding at most one partial line. Line numbers and the line-too-long error match the text path.
 */
export class ByteLineSplitter {
  lineNo = 1;
  stopped = false;
  private mode: 'unknown' | 'lf' | 'cr' = 'unknown';
  private parts: Uint8Array[] = [];
  private partsLength = 0;
  private first = true;

  constructor(
    private readonly maxLineBytes: number,
    private readonly stripUtf8Bom: boolean,
    private readonly sink: ByteLineSink,
    private readonly fast?: FastLineSink,
  ) {}

  write(chunk: Uint8Array, final: boolean): void {
    if (this.stopped) return;
    // A plain Uint8Array view of Buffers too, so the row reader sees one kind of array (and stays optimised).
    chunk = new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength);
    if (this.first && chunk.length > 0) {
      this.first = false;
      if (this.stripUtf8Bom && chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) chunk = chunk.subarray(3);
    }
    if (this.mode === 'unknown') {
      // Until the first break everything is one partial line: decide the mode on it plus this chunk.
      const total = this.partsLength + chunk.length;
      const s = this.partsLength > 0 ? this.take(chunk).subarray(0, total) : chunk;
      const lf = s.indexOf(LF);
      const cr = s.indexOf(CR);
      if (lf >= 0) this.mode = 'lf';
      else if (cr >= 0 && (cr < s.length - 1 || final)) this.mode = 'cr';
      if (this.mode === 'unknown') return this.keep(s, 0, final);
      chunk = s;
    }
    const sep = this.mode === 'lf' ? LF : CR;
    let p = 0;
    let q = chunk.indexOf(sep);
    if (this.partsLength > 0 && q >= 0) {
      const line = this.take(chunk.subarray(0, q));
      const length = line.length - 1;
      const end = sep === LF && length > 0 && line[length - 1] === CR ? length - 1 : length;
      if (!this.emit(line, 0, end)) return;
      p = q + 1;
      q = chunk.indexOf(sep, p);
    }
    // Lines that end at or before the chunk's last break are complete here; the fast sink may find their ends itself.
    const last = q >= 0 ? chunk.lastIndexOf(sep) : -1;
    const fast = this.fast;
    while (p <= last) {
      if (fast !== undefined) {
        this.lineNo += fast.take(chunk, p, last, sep);
        p = fast.next;
        if (p > last) break;
      }
      q = chunk.indexOf(sep, p);
      const end = sep === LF && q > p && chunk[q - 1] === CR ? q - 1 : q;
      if (!this.emit(chunk, p, end)) return;
      p = q + 1;
    }
    this.keep(chunk, p, final);
  }

  /** The line break byte once the first break has been seen (LF, also for CR LF; or CR), else undefined. */
  get separator(): number | undefined {
    return this.mode === 'unknown' ? undefined : this.mode === 'lf' ? LF : CR;
  }

  /** Hands over the partial line held so far (its bytes, possibly none) and forgets it. */
  takePartial(): Uint8Array {
    const length = this.partsLength;
    return length === 0 ? new Uint8Array(0) : this.take(new Uint8Array(0)).subarray(0, length);
  }

  private emit(bytes: Uint8Array, start: number, end: number): boolean {
    if (this.sink(bytes, start, end, this.lineNo++)) return true;
    this.stopped = true;
    this.parts = [];
    this.partsLength = 0;
    return false;
  }

  /** The partial line so far joined with `more` (and a trailing LF that is not part of it); the partial line is emptied. */
  private take(more: Uint8Array): Uint8Array {
    const joined = joinWithBreak([...this.parts, more], this.partsLength + more.length);
    this.parts = [];
    this.partsLength = 0;
    return joined;
  }

  /** Keeps chunk[from..] as the partial line (a copy: a source may reuse its buffer), emitting it at the end. */
  private keep(chunk: Uint8Array, from: number, final: boolean): void {
    if (from < chunk.length) {
      const copy = new Uint8Array(chunk.length - from);
      copy.set(chunk.subarray(from));
      this.parts.push(copy);
      this.partsLength += chunk.length - from;
    }
    if (this.partsLength > this.maxLineBytes) {
      throw new TransportParseError(
        'line-too-long',
        `Line ${this.lineNo} is longer than ${this.maxLineBytes} bytes without a line break; this is not a table Ohmstead can read line by line.`,
        this.lineNo,
      );
    }
    if (final && this.partsLength > 0) {
      const line = this.take(new Uint8Array(0));
      this.emit(line, 0, line.length - 1);
    }
  }
}
