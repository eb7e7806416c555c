import { AppError } from '@/lib/errors';

// The rules a new reviewer link must meet (issue 6): label 1–200 characters, expiry 1 hour to 1 year ahead.

export const LABEL_MAX_CHARS = 200;
export const DEFAULT_LINK_DAYS = 30;
const HOUR_MS = 3_600_000;
/** Clock difference tolerated between the author's browser and the server when a bound is picked exactly. */
const SKEW_MS = 30_000;

function fieldError(field: string, message: string): AppError {
  return new AppError('validation_failed', message, { fieldErrors: { [field]: message } });
}

/** Trimmed label of 1–200 characters (counted as code points), else 422 on `label`. */
export function checkLinkLabel(value: unknown): string {
  const label = typeof value === 'string' ? value.trim() : '';
  if (!label) throw fieldError('label', 'Give the link a label (for example "Referee 2, manuscript APL-4471"); only your group sees it.');
  const length = [...label].length;
  if (length > LABEL_MAX_CHARS) throw fieldError('label', `Keep the label to ${LABEL_MAX_CHARS} characters or fewer (this one has ${length}).`);
  return label;
}

/** The same calendar instant one year later (29 February → 1 March). */
export function oneYearAfter(now: Date): Date {
  const later = new Date(now.getTime());
  later.setUTCFullYear(later.getUTCFullYear() + 1);
  return later;
}

/**
 * When the link stops working. Omitted → 30 days from now. Otherwise an RFC 3339 date-time with a zone,
 * at least 1 hour and at most 1 year ahead (each bound with 30 s of grace for clocks), else 422 on `expiresAt`.
 */
export function checkLinkExpiry(value: unknown, now: Date): Date {
  if (value === undefined || value === null) return new Date(now.getTime() + DEFAULT_LINK_DAYS * 24 * HOUR_MS);
  const text = typeof value === 'string' ? value.trim() : '';
  const zoned = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/i.test(text);
  const at = zoned ? new Date(text) : new Date(NaN);
  if (Number.isNaN(at.getTime())) {
    throw fieldError('expiresAt', 'Give the expiry as a date and time with its zone, for example 2027-03-31T17:00:00Z.');
  }
  if (at.getTime() < now.getTime() + HOUR_MS - SKEW_MS) {
    throw fieldError('expiresAt', 'A review link must stay valid for at least 1 hour; choose a later expiry.');
  }
  const latest = oneYearAfter(now);
  if (at.getTime() > latest.getTime() + SKEW_MS) {
    throw fieldError('expiresAt', `A review link may stay valid for at most 1 year (until ${latest.toISOString().slice(0, 16).replace('T', ' ')} UTC); choose an earlier expiry.`);
  }
  return at;
}

export type LinkStatus = 'active' | 'expired' | 'revoked';

/** Revoked wins over expired, as in lib/access; a link is valid while now < expiresAt. */
export function linkStatus(link: { expiresAt: Date; revokedAt: Date | null }, now: Date): LinkStatus {
  if (link.revokedAt !== null) return 'revoked';
  return now.getTime() >= link.expiresAt.getTime() ? 'expired' : 'active';
}

export const NOTE_MAX_CHARS = 2000;

/** One plain address (no list, no display name, no header injection), at most 254 characters (RFC 5321 §4.5.3.1.3). */
export function checkRecipient(value: unknown): string {
  const email = typeof value === 'string' ? value.trim() : '';
  if (email.length > 254 || !/^[^\s@,;<>"]+@[^\s@,;<>"]+\.[^\s@,;<>"]+$/.test(email)) {
    throw fieldError('email', 'Give one e-mail address, for example referee@university.example.');
  }
  return email;
}

/** Optional note to the referee: trimmed, at most 2000 characters; empty → none. */
export function checkNote(value: unknown): string | null {
  const note = typeof value === 'string' ? value.trim() : '';
  if (!note) return null;
  const length = [...note].length;
  if (length > NOTE_MAX_CHARS) throw fieldError('message', `Keep the note to ${NOTE_MAX_CHARS} characters or fewer (this one has ${length}).`);
  return note;
}
