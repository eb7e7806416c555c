// Storage use in bytes and words. Check values: binary prefixes (IEC 80000-13), 1 GiB = 1 073 741 824 B; percentages
// worked by hand.
import { describe, expect, it } from 'vitest';
import { describeStorage } from '@/lib/groups/group-storage';

const GiB = 1024 ** 3;

describe('describeStorage', () => {
  it('an empty group of the default 50 GiB quota', () => {
    expect(describeStorage(0, 50 * GiB)).toEqual({
      usedBytes: 0, quotaBytes: 50 * GiB, freeBytes: 50 * GiB, percentUsed: 0, level: 'ok', summary: '0 B of 50.0 GiB used (0 %), 50.0 GiB free',
    });
  });

  it('a little use does not read as 0 %', () => {
    expect(describeStorage(228_352, 50 * GiB).summary).toBe('223.0 KiB of 50.0 GiB used (under 0.1 %), 50.0 GiB free');
  });

  it('45 of 50 GiB is 90 %: nearly full', () => {
    expect(describeStorage(45 * GiB, 50 * GiB)).toMatchObject({ percentUsed: 90, level: 'high', freeBytes: 5 * GiB, summary: '45.0 GiB of 50.0 GiB used (90 %), 5.00 GiB free' });
  });

  it('use at or over the quota is full, with nothing free (a lowered quota can leave a group over it)', () => {
    expect(describeStorage(2 * GiB, 2 * GiB)).toMatchObject({ percentUsed: 100, level: 'full', freeBytes: 0 });
    expect(describeStorage(3 * GiB, 2 * GiB)).toMatchObject({ percentUsed: 150, level: 'full', freeBytes: 0 });
  });
});
