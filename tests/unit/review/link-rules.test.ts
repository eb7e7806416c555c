// Rules for a new reviewer link (issue 6 brief): label 1–200 characters, expiry 1 hour to 1 year ahead, default 30 days.
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { checkLinkExpiry, checkLinkLabel, checkNote, checkRecipient, linkStatus, oneYearAfter } from '@/lib/review/link-rules';

const NOW = new Date('2031-03-01T12:00:00.000Z');

function refusal(fn: () => unknown): { field: string; message: string } {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    const e = error as AppError;
    expect([e.code, e.status]).toEqual(['validation_failed', 422]);
    const [field, message] = Object.entries(e.details?.fieldErrors ?? {})[0];
    return { field, message };
  }
  throw new Error('expected a 422');
}

describe('checkLinkLabel', () => {
  it('trims and keeps 1–200 characters, counted as code points', () => {
    expect(checkLinkLabel('  Referee 2, manuscript APL-4471  ')).toBe('Referee 2, manuscript APL-4471');
    expect(checkLinkLabel('Ω'.repeat(200))).toHaveLength(200);
  });

  it('refuses empty, blank, non-string and 201 characters', () => {
    expect(refusal(() => checkLinkLabel('   ')).field).toBe('label');
    expect(refusal(() => checkLinkLabel(42)).field).toBe('label');
    expect(refusal(() => checkLinkLabel('x'.repeat(201))).message).toBe('Keep the label to 200 characters or fewer (this one has 201).');
  });
});

describe('checkLinkExpiry', () => {
  it('defaults to 30 days ahead', () => {
    expect(checkLinkExpiry(undefined, NOW).toISOString()).toBe('2031-03-31T12:00:00.000Z');
    expect(checkLinkExpiry(null, NOW).toISOString()).toBe('2031-03-31T12:00:00.000Z');
  });

  it('accepts 1 hour and 1 year ahead, and zone offsets', () => {
    expect(checkLinkExpiry('2031-03-01T13:00:00Z', NOW).toISOString()).toBe('2031-03-01T13:00:00.000Z');
    expect(checkLinkExpiry('2032-03-01T12:00:00Z', NOW).toISOString()).toBe('2032-03-01T12:00:00.000Z');
    expect(checkLinkExpiry('2031-06-01T09:30:00+02:00', NOW).toISOString()).toBe('2031-06-01T07:30:00.000Z');
  });

  it('refuses 59 minutes ahead, the past, and more than a year (with the latest allowed instant)', () => {
    expect(refusal(() => checkLinkExpiry('2031-03-01T12:59:00Z', NOW))).toEqual({
      field: 'expiresAt', message: 'A review link must stay valid for at least 1 hour; choose a later expiry.',
    });
    expect(refusal(() => checkLinkExpiry('2030-01-01T00:00:00Z', NOW)).field).toBe('expiresAt');
    expect(refusal(() => checkLinkExpiry('2032-03-02T12:00:00Z', NOW)).message).toBe(
      'A review link may stay valid for at most 1 year (until 2032-03-01 12:00 UTC); choose an earlier expiry.',
    );
  });

  it('refuses dates without a time or zone and nonsense', () => {
    for (const bad of ['2031-04-01', '2031-04-01T12:00:00', 'next week', '2031-02-30T25:00:00Z', 17]) {
      expect(refusal(() => checkLinkExpiry(bad, NOW)).field).toBe('expiresAt');
    }
  });

  it('one year after 29 February is 1 March', () => {
    expect(oneYearAfter(new Date('2032-02-29T08:00:00Z')).toISOString()).toBe('2033-03-01T08:00:00.000Z');
  });
});

describe('linkStatus', () => {
  const expiresAt = new Date('2031-03-10T00:00:00Z');
  it('active until the exact expiry instant, then expired; revoked wins', () => {
    expect(linkStatus({ expiresAt, revokedAt: null }, new Date(expiresAt.getTime() - 1))).toBe('active');
    expect(linkStatus({ expiresAt, revokedAt: null }, expiresAt)).toBe('expired');
    expect(linkStatus({ expiresAt, revokedAt: NOW }, new Date('2031-04-01T00:00:00Z'))).toBe('revoked');
  });
});

describe('checkRecipient and checkNote', () => {
  it('takes one plain address', () => {
    expect(checkRecipient('  referee@university.example ')).toBe('referee@university.example');
    for (const bad of ['a@b.example, c@d.example', 'Ref <a@b.example>', 'a@b.example\r\nBcc: x@y.example', 'nobody', '']) {
      expect(refusal(() => checkRecipient(bad)).field).toBe('email');
    }
  });

  it('keeps a note up to 2000 characters; blank is none', () => {
    expect(checkNote('  Thanks for reviewing.  ')).toBe('Thanks for reviewing.');
    expect(checkNote('   ')).toBeNull();
    expect(checkNote(undefined)).toBeNull();
    expect(refusal(() => checkNote('n'.repeat(2001))).field).toBe('message');
  });
});
