// The reviewer mail: plain text and HTML parts, nothing about the authors in anonymous mode, and its sealed form
// in the outbox (AES-256-GCM, NIST SP 800-38D) that a database reader cannot open or alter.
import { describe, expect, it } from 'vitest';
import { renderMail } from '@/lib/notify/render-mail';
import { reviewerLinkMail } from '@/lib/review/reviewer-mail';
import { sealPayload, unsealPayload } from '@/lib/review/sealed-payload';
import { summariseLink } from '@/lib/review/link-summary';

const facts = {
  title: 'ρ(T) of a Nb thin film, 2–300 K', versionNumber: 2, url: 'http://localhost:3000/review/abcDEF_123-xyz',
  expiresAt: new Date('2031-03-31T17:00:00.000Z'), message: 'Dear referee,\nthe curves for sample B are in "Curves".',
};

describe('reviewerLinkMail', () => {
  it('names the sender and group when not anonymous, with link, expiry and note', () => {
    const mail = renderMail(reviewerLinkMail({ ...facts, sender: { name: 'Odile Brackenridge', groupName: 'Tidewater Thin Films Group' } }));
    expect(mail.subject).toBe('Confidential review copy: ρ(T) of a Nb thin film, 2–300 K');
    expect(mail.text).toContain('Odile Brackenridge (Tidewater Thin Films Group) has given you private access to a dataset on Ohmstead for review.');
    expect(mail.text).toContain('Open the review copy: http://localhost:3000/review/abcDEF_123-xyz');
    expect(mail.text).toContain('Link valid until: 2031-03-31 17:00 UTC');
    expect(mail.text).toContain('> Dear referee,\n> the curves for sample B are in "Curves".');
    expect(mail.html).toContain('<a href="http://localhost:3000/review/abcDEF_123-xyz"');
    expect(mail.html).toContain('the curves for sample B are in &quot;Curves&quot;.');
  });

  it('in anonymous mode names neither authors nor group, in either part', () => {
    const mail = renderMail(reviewerLinkMail({ ...facts, sender: null, message: null }));
    expect(mail.text).toContain('The authors of a dataset on Ohmstead have given you private access to it for review.');
    for (const part of [mail.subject, mail.text, mail.html]) {
      expect(part).not.toMatch(/Brackenridge|Tidewater|Their note/);
    }
    expect(mail.text).toContain('never who used it');
  });
});

describe('sealPayload / unsealPayload', () => {
  const secret = 'unit-test-secret-of-at-least-32-characters!';
  const value = { to: 'referee@university.example', subject: 's', text: 't', html: '<p>h</p>' };

  it('round-trips, and the sealed text shows neither address nor link', () => {
    const sealed = sealPayload(secret, { ...value, text: facts.url });
    expect(unsealPayload(secret, sealed)).toEqual({ ...value, text: facts.url });
    expect(sealed).not.toContain('referee');
    expect(sealed).not.toContain('review');
    expect(sealPayload(secret, value)).not.toBe(sealPayload(secret, value)); // fresh IV each time
  });

  it('refuses another secret, one altered byte and a short text', () => {
    const sealed = sealPayload(secret, value);
    expect(() => unsealPayload(`${secret}x`, sealed)).toThrow();
    const raw = Buffer.from(sealed, 'base64url');
    raw[raw.length - 1] ^= 1;
    expect(() => unsealPayload(secret, raw.toString('base64url'))).toThrow();
    expect(() => unsealPayload(secret, 'abc')).toThrow('sealed payload is too short');
  });
});

describe('summariseLink', () => {
  it('shows status, times in ISO and use counts, and never a token or hash', () => {
    const row = {
      id: 'l-1', version_id: 'v-1', label: 'Referee 1', anonymous: true, expires_at: new Date('2031-03-31T00:00:00Z'), revoked_at: null,
      last_used_at: new Date('2031-03-02T10:01:00Z'), created_at: new Date('2031-03-01T09:00:00Z'), created_by_name: 'Sela Marchbank',
      views: 3, downloads: 1, token_hash: 'f'.repeat(64),
    };
    const summary = summariseLink(row, new Date('2031-03-05T00:00:00Z'));
    expect(summary).toEqual({
      id: 'l-1', versionId: 'v-1', label: 'Referee 1', anonymous: true, status: 'active', expiresAt: '2031-03-31T00:00:00.000Z', revokedAt: null,
      lastUsedAt: '2031-03-02T10:01:00.000Z', createdAt: '2031-03-01T09:00:00.000Z', createdBy: 'Sela Marchbank', uses: { views: 3, downloads: 1 },
    });
    expect(JSON.stringify(summary)).not.toContain('f'.repeat(64));
    expect(summariseLink(row, new Date('2031-04-01T00:00:00Z')).status).toBe('expired');
  });
});
