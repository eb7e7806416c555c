import { describe, expect, it } from 'vitest';
import { expectedPartBytes, GiB, MiB, planParts, quotaProblem } from '@/lib/uploads/limits';
import { checkFileName } from '@/lib/uploads/safe-name';
import { hasTextExtension, isAnalysable, looksLikeText } from '@/lib/uploads/text-like';

describe('planParts', () => {
  it.each([
    // [size, part size, part count]: 8 MiB parts up to 10 000 × 8 MiB (S3's 10 000-part limit), then whole MiB.
    [0, 8 * MiB, 1],
    [1, 8 * MiB, 1],
    [8 * MiB, 8 * MiB, 1],
    [8 * MiB + 1, 8 * MiB, 2],
    [20 * GiB, 8 * MiB, 2560],
    [10_000 * 8 * MiB, 8 * MiB, 10_000],
    [10_000 * 8 * MiB + 1, 9 * MiB, 8889],
    [200 * GiB, 21 * MiB, 9753],
  ])('a %d-byte file → %d-byte parts × %d', (size, partSize, count) => {
    const plan = planParts(size);
    expect(plan).toEqual({ partSizeBytes: partSize, partCount: count });
    expect(plan.partCount).toBeLessThanOrEqual(10_000);
    expect((plan.partCount - 1) * plan.partSizeBytes + expectedPartBytes(size, plan, plan.partCount)).toBe(size);
  });

  it('expects full parts, then the remainder', () => {
    const plan = planParts(9.5 * MiB);
    expect([1, 2].map((n) => expectedPartBytes(9.5 * MiB, plan, n))).toEqual([8 * MiB, 1.5 * MiB]);
  });
});

describe('quotaProblem', () => {
  const q = { groupName: 'Larkspur Cryogenic Lab', quotaBytes: 10 * GiB, usedBytes: 9 * GiB, pendingBytes: 512 * MiB };

  it('lets a file through that fits in what is neither used nor reserved', () => {
    expect(quotaProblem(q, 512 * MiB)).toBeNull();
  });

  it('says in words why a file does not fit', () => {
    expect(quotaProblem(q, 512 * MiB + 1)).toBe(
      'Larkspur Cryogenic Lab has 10.0 GiB of storage; 9.00 GiB is used and 512.0 MiB is reserved by uploads in progress, so 512.0 MiB is free, ' +
        'but this file is 512.0 MiB. Remove files from drafts, or ask a group owner to raise the quota.',
    );
  });

  it('never reports negative free space for an over-full group', () => {
    expect(quotaProblem({ ...q, usedBytes: 11 * GiB, pendingBytes: 0 }, 1)).toContain('so 0 B is free');
  });
});

describe('checkFileName', () => {
  it.each(['../../etc/passwd', 'a/b\\c.csv', 'tab\there.csv', 'CON', 'Ω-sweep μA.dat', '😀.csv'])('keeps %j as given', (name) => {
    expect(checkFileName(name)).toEqual({ ok: true, name });
  });

  it('trims surrounding white space only', () => {
    expect(checkFileName('  run 3 .csv \n')).toEqual({ ok: true, name: 'run 3 .csv' });
  });

  it('counts characters, not UTF-16 units: 255 emoji fit, 256 do not', () => {
    expect(checkFileName('😀'.repeat(255)).ok).toBe(true);
    expect(checkFileName('😀'.repeat(256))).toEqual({ ok: false, message: 'The file name is longer than 255 characters. Shorten it.' });
  });

  it.each([
    [42, 'Give the file a name.'],
    ['', 'The file name is empty.'],
    ['a\u0000b', 'The file name contains a NUL character, which no file system accepts. Rename the file.'],
    ['\uDC00x', 'The file name is not valid Unicode text. Rename the file.'],
  ])('refuses %j', (name, message) => {
    expect(checkFileName(name)).toEqual({ ok: false, message });
  });
});

describe('what gets analysed', () => {
  const text = new TextEncoder().encode('T (K),R (Ohm)\n300,1.5\n');
  const binary = Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00]); // a zip header

  it('knows the usual text extensions, case-insensitively', () => {
    expect(['a.csv', 'B.TSV', 'c.txt', 'run.dat', 'x.Log'].map(hasTextExtension)).toEqual([true, true, true, true, true]);
    expect(['a.zip', 'b.png', 'csv', 'noext'].map(hasTextExtension)).toEqual([false, false, false, false]);
  });

  it('tells text from binary by the first bytes, UTF-16 included', () => {
    expect(looksLikeText(text, true)).toBe(true);
    expect(looksLikeText(binary, true)).toBe(false);
    expect(looksLikeText(Uint8Array.from([0xff, 0xfe, 0x54, 0x00, 0x0a, 0x00]), true)).toBe(true);
    expect(looksLikeText(new Uint8Array(0), true)).toBe(false);
  });

  it('analyses a text extension even when empty, and extensionless text', () => {
    expect(isAnalysable('empty.csv', new Uint8Array(0), true)).toBe(true);
    expect(isAnalysable('RUN0042', text, true)).toBe(true);
    expect(isAnalysable('archive.zip', binary, true)).toBe(false);
  });
});
