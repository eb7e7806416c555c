// Range decisions checked against RFC 9110 §14.1.2's own examples (a representation of 10000 bytes) and its rules.
import { describe, expect, it } from 'vitest';
import { contentRange, decideRange, ifRangeHolds, unsatisfiedRange } from '@/lib/downloads/range';

const partial = (start: number, end: number) => ({ kind: 'partial', range: { start, end } });

describe('decideRange (RFC 9110 §14.1.2 examples, 10000 bytes)', () => {
  it.each([
    ['bytes=0-499', partial(0, 499)], // the first 500 bytes
    ['bytes=500-999', partial(500, 999)], // the second 500 bytes
    ['bytes=-500', partial(9500, 9999)], // the final 500 bytes
    ['bytes=9500-', partial(9500, 9999)], // the final 500 bytes
    ['bytes=0-0,-1', { kind: 'whole' }], // first and last byte: several ranges, served whole (§14.2 allows it)
  ])('%s', (header, expected) => {
    expect(decideRange(header, 10_000)).toEqual(expected);
  });
});

describe('decideRange edge cases', () => {
  it.each([
    [null, 100, { kind: 'whole' }],
    ['', 100, { kind: 'whole' }],
    ['items=0-5', 100, { kind: 'whole' }], // unknown unit: ignored
    ['bytes=5', 100, { kind: 'whole' }], // no dash: malformed
    ['bytes=9-3', 100, { kind: 'whole' }], // last < first: invalid, ignored (§14.1.1)
    ['bytes=a-3', 100, { kind: 'whole' }],
    ['bytes=-', 100, { kind: 'whole' }],
    ['bytes=0-99999', 100, partial(0, 99)], // last position clamped
    ['bytes=-100000', 100, partial(0, 99)], // suffix longer than the representation: all of it
    ['bytes=99-', 100, partial(99, 99)],
    ['bytes=100-', 100, { kind: 'unsatisfiable' }], // first position at the length
    ['bytes=123456789012345678901234-', 100, { kind: 'unsatisfiable' }],
    ['bytes=-0', 100, { kind: 'unsatisfiable' }], // zero-length suffix (§14.1.1)
    ['bytes=0-5', 0, { kind: 'whole' }], // an empty file has no byte to address
  ])('%s on %i bytes', (header, size, expected) => {
    expect(decideRange(header, size)).toEqual(expected);
  });

  it('writes Content-Range for 206 and 416 as §14.4 spells them', () => {
    expect(contentRange({ start: 0, end: 499 }, 10_000)).toBe('bytes 0-499/10000');
    expect(unsatisfiedRange(10_000)).toBe('bytes */10000');
  });

  it('applies a range only while If-Range names the current ETag (§13.1.5)', () => {
    expect(ifRangeHolds(null, '"abc"')).toBe(true);
    expect(ifRangeHolds('"abc"', '"abc"')).toBe(true);
    expect(ifRangeHolds('W/"abc"', '"abc"')).toBe(false); // weak validators never match for If-Range
    expect(ifRangeHolds('Tue, 01 Dec 2026 10:00:00 GMT', '"abc"')).toBe(false);
  });
});
