// Embargo date rules (issue 5): after today (UTC), at most five years ahead (common practice caps data embargoes
// at a few years); files open at 00:00 UTC on the date.
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { addYears, checkEmbargoDate, embargoWindow } from '@/lib/publishing/embargo';

const now = new Date('2026-12-02T23:30:00Z'); // late evening UTC: "today" is still 2 December

function refusal(value: unknown, at = now): AppError {
  try {
    checkEmbargoDate(value, at);
  } catch (error) {
    return error as AppError;
  }
  throw new Error(`expected ${JSON.stringify(value)} to be refused`);
}

describe('checkEmbargoDate', () => {
  it('accepts tomorrow through the same day five years on, and null/undefined as "no embargo"', () => {
    expect(embargoWindow(now)).toEqual({ first: '2026-12-03', last: '2031-12-02' });
    expect(checkEmbargoDate('2026-12-03', now)).toBe('2026-12-03');
    expect(checkEmbargoDate('2031-12-02', now)).toBe('2031-12-02');
    expect(checkEmbargoDate(null, now)).toBeNull();
    expect(checkEmbargoDate(undefined, now)).toBeNull();
  });

  it('refuses today and past days with both limits in the message (422)', () => {
    const e = refusal('2026-12-02');
    expect([e.code, e.status]).toEqual(['validation_failed', 422]);
    expect(e.message).toBe(
      '2026-12-02 is not after today. The embargo date must be after today (2026-12-02, UTC) and at most 5 years ahead ' +
        '(2031-12-02): choose a day from 2026-12-03 to 2031-12-02. Longer embargoes are not usual practice for research data.',
    );
    expect(e.details?.fieldErrors?.embargoUntil).toBe(e.message);
    expect(refusal('1999-01-01').message).toMatch(/^1999-01-01 is not after today\./);
  });

  it('refuses a day more than five years ahead', () => {
    expect(refusal('2031-12-03').message).toMatch(/^2031-12-03 is more than 5 years ahead\. /);
    expect(refusal('9999-12-31').message).toMatch(/^9999-12-31 is more than 5 years ahead\. /);
  });

  it('refuses what is not a calendar day', () => {
    for (const bad of ['2027-02-30', '2027-13-01', '2027-1-5', '2027-01-05T00:00:00Z', 'soon', 20270105, '']) {
      expect(refusal(bad).message).toMatch(/^Give the embargo date as a calendar day, YYYY-MM-DD \(got /);
    }
  });
});

describe('addYears', () => {
  it('keeps the calendar day, moving 29 February to 28 February in a common year', () => {
    expect(addYears('2026-12-02', 5)).toBe('2031-12-02');
    expect(addYears('2028-02-29', 5)).toBe('2033-02-28');
    expect(addYears('2028-02-29', 4)).toBe('2032-02-29');
  });
});
