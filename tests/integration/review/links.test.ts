// Reviewer links against MariaDB: create, list, revoke, expire, resolve (tampered/truncated/guessed → not_found).
// Rules: issue 6 and product.md "Reviewer links"; who may manage links is lib/access/permissions.ts ('manage_links').
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { createReviewerLink } from '@/lib/review/create-reviewer-link';
import { listReviewerLinks } from '@/lib/review/list-reviewer-links';
import { resolveReviewerLink } from '@/lib/review/resolve-reviewer-link';
import { revokeReviewerLink } from '@/lib/review/revoke-reviewer-link';
import { generateReviewToken } from '@/lib/review/token';
import { closeDb, makeReviewLab, makeVersion, rejection, removeReviewLab, type ReviewLab } from './fixtures';

let lab: ReviewLab;
let draftId: string;

beforeAll(async () => {
  lab = await makeReviewLab('review-links');
  draftId = await makeVersion(lab, 'draft', 'Hall bar of an invented 2DEG, 1.8–300 K');
});
afterAll(async () => {
  await removeReviewLab(lab);
  await closeDb();
});

const HOUR = 3_600_000;

describe('createReviewerLink', () => {
  it('returns the token once; the database keeps only its SHA-256; default expiry is 30 days', async () => {
    const now = new Date();
    const created = await createReviewerLink({ user: lab.member, versionId: draftId, input: { label: '  Referee 1, APL-4471 ' } }, now);
    expect(created.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(created.url).toBe(`${process.env.NEXTAUTH_URL!.replace(/\/+$/, '')}/review/${created.token}`);
    expect(created.link).toMatchObject({ versionId: draftId, label: 'Referee 1, APL-4471', anonymous: false, status: 'active', revokedAt: null, lastUsedAt: null, createdBy: 'Liesl Damaris', uses: { views: 0, downloads: 0 } });
    const expiry = new Date(created.link.expiresAt).getTime();
    expect(Math.abs(expiry - (now.getTime() + 30 * 24 * HOUR))).toBeLessThan(1000); // DATETIME keeps whole seconds

    const row = await db()('reviewer_links').where('id', created.link.id).first();
    expect(row.token_hash).toBe(createHash('sha256').update(created.token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(created.token);
    const audit = await db()('audit_log').where({ target_id: created.link.id }).select('action', 'actor_user_id', 'details');
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['reviewer_link.create']);
    expect(audit[0].actor_user_id).toBe(lab.member.id);
    expect(JSON.stringify(audit)).not.toContain(created.token);
    expect(JSON.stringify(audit)).not.toContain(row.token_hash);
  });

  it('stores the anonymous flag and an explicit expiry', async () => {
    const now = new Date();
    const expiresAt = new Date(now.getTime() + 7 * 24 * HOUR);
    expiresAt.setUTCMilliseconds(0);
    const created = await createReviewerLink({ user: lab.curator, versionId: draftId, input: { label: 'Anonymous referee', anonymous: true, expiresAt: expiresAt.toISOString() } }, now);
    expect(created.link).toMatchObject({ anonymous: true, expiresAt: expiresAt.toISOString() });
  });

  it('refuses a bad label or expiry with 422 and the field', async () => {
    const noLabel = await rejection(createReviewerLink({ user: lab.member, versionId: draftId, input: { label: '   ' } }));
    expect([noLabel.status, Object.keys(noLabel.details?.fieldErrors ?? {})]).toEqual([422, ['label']]);
    const soon = new Date(Date.now() + 30 * 60_000).toISOString();
    const tooSoon = await rejection(createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'x', expiresAt: soon } }));
    expect([tooSoon.status, tooSoon.details?.fieldErrors?.expiresAt]).toEqual([422, 'A review link must stay valid for at least 1 hour; choose a later expiry.']);
    const late = new Date(Date.now() + 400 * 24 * HOUR).toISOString();
    const tooLate = await rejection(createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'x', expiresAt: late } }));
    expect([tooLate.status, Object.keys(tooLate.details?.fieldErrors ?? {})]).toEqual([422, ['expiresAt']]);
  });

  it('hides a draft from outsiders (404), refuses anonymous visitors, and refuses links on a withdrawn version (403)', async () => {
    for (const user of [lab.outsider, null]) {
      const e = await rejection(createReviewerLink({ user, versionId: draftId, input: { label: 'x' } }));
      expect([e.status, e.code]).toEqual([404, 'not_found']);
    }
    const withdrawn = await makeVersion(lab, 'withdrawn', 'Withdrawn copy');
    const e = await rejection(createReviewerLink({ user: lab.owner, versionId: withdrawn, input: { label: 'x' } }));
    expect([e.status, e.code]).toEqual([403, 'wrong_state']);
    expect(await db()('reviewer_links').where('version_id', withdrawn).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('resolveReviewerLink', () => {
  let token: string;
  beforeAll(async () => {
    token = (await createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'Resolve me' } })).token;
  });

  it('a valid token gives the lib/access grant of its version', async () => {
    const r = await resolveReviewerLink(token);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.grant).toMatchObject({ versionId: draftId, revokedAt: null, anonymous: false });
  });

  it('tampered, truncated, extended, guessed, case-changed and empty tokens → not_found, each for one query', async () => {
    const flip = (i: number) => token.slice(0, i) + (token[i] === 'A' ? 'B' : 'A') + token.slice(i + 1);
    const bad = [flip(0), flip(21), flip(42), token.slice(0, 42), token.slice(0, 20), `${token}A`, generateReviewToken(), token.toUpperCase(), '', '../../etc', `${token} `];
    let queries = 0;
    const count = () => { queries += 1; };
    db().on('query', count);
    try {
      for (const t of bad) {
        const before = queries;
        expect(await resolveReviewerLink(t)).toEqual({ ok: false, reason: 'not_found' });
        expect(queries - before).toBe(1);
      }
      const before = queries;
      expect((await resolveReviewerLink(token)).ok).toBe(true);
      expect(queries - before).toBe(1); // the valid path costs the same single query
    } finally {
      db().off('query', count);
    }
  });

  it('takes about as long for a guessed token as for tampered and truncated ones (interleaved medians of 80 runs within a factor of 3)', async () => {
    const inputs = [generateReviewToken(), token.slice(0, 42) + (token[42] === 'A' ? 'B' : 'A'), token.slice(0, 10)];
    const times: number[][] = inputs.map(() => []);
    // Interleaved, so a busy neighbour on the shared machine slows every kind of input alike.
    for (let round = 0; round < 80; round++) {
      for (const [i, t] of inputs.entries()) {
        const start = process.hrtime.bigint();
        await resolveReviewerLink(t);
        times[i].push(Number(process.hrtime.bigint() - start));
      }
    }
    const [guessed, tampered, truncated] = times.map((list) => list.sort((a, b) => a - b)[40]);
    for (const m of [tampered, truncated]) expect(Math.max(m, guessed) / Math.min(m, guessed)).toBeLessThan(3);
  });
});

describe('expiry and revocation', () => {
  it('a link past its expiry resolves as expired', async () => {
    const past = new Date(Date.now() - 3 * HOUR);
    const created = await createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'Short-lived', expiresAt: new Date(past.getTime() + 61 * 60_000).toISOString() } }, past);
    expect(await resolveReviewerLink(created.token)).toEqual({ ok: false, reason: 'expired' });
    const listed = (await listReviewerLinks({ user: lab.member, versionId: draftId })).find((l) => l.id === created.link.id);
    expect(listed?.status).toBe('expired');
  });

  it('revoke stops the link at once, keeps the first revocation time, and is audited once', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'To revoke' } });
    const revoked = await revokeReviewerLink({ user: lab.owner, linkId: created.link.id });
    expect(revoked.status).toBe('revoked');
    expect(await resolveReviewerLink(created.token)).toEqual({ ok: false, reason: 'revoked' });
    const again = await revokeReviewerLink({ user: lab.owner, linkId: created.link.id });
    expect(again.revokedAt).toBe(revoked.revokedAt);
    const audit = await db()('audit_log').where({ target_id: created.link.id }).orderBy('id').pluck('action');
    expect(audit).toEqual(['reviewer_link.create', 'reviewer_link.revoke']);
  });

  it('outsiders cannot revoke (404 for a draft) and unknown ids are 404', async () => {
    const created = await createReviewerLink({ user: lab.member, versionId: draftId, input: { label: 'Keep me' } });
    const e = await rejection(revokeReviewerLink({ user: lab.outsider, linkId: created.link.id }));
    expect([e.status, e.code]).toEqual([404, 'not_found']);
    const unknown = await rejection(revokeReviewerLink({ user: lab.owner, linkId: '00000000-0000-4000-8000-000000000000' }));
    expect([unknown.status, unknown.message]).toEqual([404, 'We could not find this review link, or you do not have access to it.']);
    expect(await resolveReviewerLink(created.token)).toMatchObject({ ok: true });
  });
});

describe('listReviewerLinks', () => {
  it('lists the version’s links newest first for the group, never with a token or hash', async () => {
    const version = await makeVersion(lab, 'in_review', 'Listed links');
    const a = await createReviewerLink({ user: lab.member, versionId: version, input: { label: 'First' } }, new Date(Date.now() - 5000));
    const b = await createReviewerLink({ user: lab.curator, versionId: version, input: { label: 'Second', anonymous: true } });
    const links = await listReviewerLinks({ user: lab.owner, versionId: version });
    expect(links.map((l) => [l.label, l.anonymous, l.createdBy])).toEqual([['Second', true, 'Oskar Pennywhistle'], ['First', false, 'Liesl Damaris']]);
    const text = JSON.stringify(links);
    for (const secret of [a.token, b.token, createHash('sha256').update(a.token).digest('hex')]) expect(text).not.toContain(secret);
    const e = await rejection(listReviewerLinks({ user: lab.outsider, versionId: version }));
    expect(e.status).toBe(404);
  });
});
