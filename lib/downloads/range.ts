// HTTP Range for single-file downloads (RFC 9110 §14): one byte range is served, anything else gets the whole file.

/** Inclusive byte positions, as Content-Range writes them. */
export type ByteRange = { start: number; end: number };

export type RangeDecision =
  /** No Range, another unit, several ranges, or a malformed one: answer 200 with the whole file (§14.2 lets us ignore it). */
  | { kind: 'whole' }
  | { kind: 'partial'; range: ByteRange }
  /** 416 with Content-Range "bytes *\/size" (§15.5.17). */
  | { kind: 'unsatisfiable' };

const WHOLE: RangeDecision = { kind: 'whole' };
const UNSATISFIABLE: RangeDecision = { kind: 'unsatisfiable' };
const DIGITS = /^\d+$/;

/**
 * Reads a Range header against a representation of `sizeBytes` bytes: "bytes=a-b", "bytes=a-" and "bytes=-n"
 * (§14.1.1). A last position past the end is clamped to it; a suffix longer than the file means the whole file as
 * 206. An empty file has no byte to address, so any Range is ignored there.
 */
export function decideRange(header: string | null | undefined, sizeBytes: number): RangeDecision {
  if (!header) return WHOLE;
  const m = /^\s*bytes\s*=\s*(.*)$/i.exec(header);
  if (!m) return WHOLE;
  const spec = m[1]!.trim();
  if (spec.includes(',')) return WHOLE; // several ranges: a multipart/byteranges answer is optional (§14.2)
  const dash = spec.indexOf('-');
  if (dash < 0 || sizeBytes === 0) return WHOLE;
  const first = spec.slice(0, dash).trim();
  const last = spec.slice(dash + 1).trim();
  const lastByte = sizeBytes - 1;

  if (first === '') {
    if (!DIGITS.test(last)) return WHOLE;
    const suffix = Number(last);
    if (suffix === 0) return UNSATISFIABLE; // §14.1.1: a suffix range is satisfiable only with a non-zero length
    return { kind: 'partial', range: { start: Math.max(0, sizeBytes - suffix), end: lastByte } };
  }
  if (!DIGITS.test(first) || (last !== '' && !DIGITS.test(last))) return WHOLE;
  const start = Number(first);
  if (last !== '' && Number(last) < start) return WHOLE; // last < first is invalid (§14.1.1), so ignored
  if (!Number.isSafeInteger(start) || start > lastByte) return UNSATISFIABLE;
  const end = last === '' ? lastByte : Math.min(Number(last), lastByte);
  return { kind: 'partial', range: { start, end } };
}

/** "bytes a-b/size" for a 206 answer. */
export function contentRange(range: ByteRange, sizeBytes: number): string {
  return `bytes ${range.start}-${range.end}/${sizeBytes}`;
}

/** "bytes *\/size" for a 416 answer. */
export function unsatisfiedRange(sizeBytes: number): string {
  return `bytes */${sizeBytes}`;
}

export const rangeLength = (range: ByteRange): number => range.end - range.start + 1;

/**
 * If-Range (§13.1.5): the range applies only while the client's validator is our current strong ETag. Dates are not
 * compared (files are content-addressed; the ETag is the validator that counts), so a date means "send it whole".
 */
export function ifRangeHolds(ifRange: string | null | undefined, etag: string): boolean {
  if (!ifRange) return true;
  return ifRange.trim() === etag;
}
