import { AppError } from '@/lib/errors';

// Embargo dates: a calendar day (UTC); files open at 00:00 UTC on it (lib/access/embargo.ts decides access).

/** Common practice: repositories and funders cap data embargoes at a few years; we allow up to five. */
export const MAX_EMBARGO_YEARS = 5;

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** Today's date in UTC as YYYY-MM-DD. */
export function utcDay(now: Date): string {
  return now.toISOString().slice(0, 10);
}

/** The same calendar day `years` later; 29 February becomes 28 February in a common year. */
export function addYears(day: string, years: number): string {
  const [y, m, d] = day.split('-').map(Number);
  const lastOfMonth = new Date(Date.UTC(y + years, m, 0)).getUTCDate();
  return new Date(Date.UTC(y + years, m - 1, Math.min(d, lastOfMonth))).toISOString().slice(0, 10);
}

function isCalendarDay(value: string): boolean {
  if (!DAY.test(value)) return false;
  const parsed = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(parsed.getTime()) && parsed.toISOString().slice(0, 10) === value;
}

/** The allowed window for an embargo date chosen on `now`: [first, last], both inclusive. */
export function embargoWindow(now: Date): { first: string; last: string } {
  const today = utcDay(now);
  const tomorrow = new Date(Date.parse(`${today}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
  return { first: tomorrow, last: addYears(today, MAX_EMBARGO_YEARS) };
}

/**
 * Checks an embargo date (YYYY-MM-DD, UTC): after today and at most five years ahead. Null/undefined mean
 * "no embargo". Throws 422 with fieldErrors[field] naming both limits.
 */
export function checkEmbargoDate(value: unknown, now: Date, field = 'embargoUntil'): string | null {
  if (value === null || value === undefined) return null;
  const { first, last } = embargoWindow(now);
  const limits =
    `The embargo date must be after today (${utcDay(now)}, UTC) and at most ${MAX_EMBARGO_YEARS} years ahead ` +
    `(${last}): choose a day from ${first} to ${last}. Longer embargoes are not usual practice for research data.`;
  const refuse = (message: string) => new AppError('validation_failed', message, { fieldErrors: { [field]: message } });
  if (typeof value !== 'string' || !isCalendarDay(value)) {
    throw refuse(`Give the embargo date as a calendar day, YYYY-MM-DD (got ${JSON.stringify(value)}). ${limits}`);
  }
  if (value < first) throw refuse(`${value} is not after today. ${limits}`);
  if (value > last) throw refuse(`${value} is more than ${MAX_EMBARGO_YEARS} years ahead. ${limits}`);
  return value;
}
