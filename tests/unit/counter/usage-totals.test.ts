// COUNTER metrics from database rows: investigations include requests; SUM arrives from MariaDB as a decimal string.
import { describe, expect, it } from 'vitest';
import { addTotals, NO_USAGE, totalsFromRow } from '@/lib/counter/usage-totals';

describe('totalsFromRow / addTotals', () => {
  it('turns COUNT numbers and SUM strings into integers; no row → zeros', () => {
    expect(totalsFromRow({ inv_total: 7, inv_unique: 3, req_total: '2', req_unique: 1 })).toEqual({
      investigations: { total: 7, unique: 3 }, requests: { total: 2, unique: 1 },
    });
    expect(totalsFromRow({ inv_total: 0, inv_unique: 0, req_total: null, req_unique: 0 })).toEqual(NO_USAGE);
    expect(totalsFromRow(undefined)).toEqual(NO_USAGE);
  });

  it('adds per-item metrics field by field', () => {
    const a = totalsFromRow({ inv_total: 7, inv_unique: 3, req_total: '2', req_unique: 1 });
    const b = totalsFromRow({ inv_total: 4, inv_unique: 4, req_total: '4', req_unique: 2 });
    expect(addTotals(a, b)).toEqual({ investigations: { total: 11, unique: 7 }, requests: { total: 6, unique: 3 } });
  });
});
