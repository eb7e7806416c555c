// Which Ohmstead user an ORCID sign-in becomes, against MariaDB; then next-auth's adapter must find that user.
import { randomInt } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { knexAdapter } from '@/lib/auth/repo-adapter';
import { db } from '@/lib/db';
import { orcidCheckDigit } from '@/lib/schema/orcid';
import { linkOrcidSignIn, OrcidSignInError, placeholderEmail } from '@/lib/users/link-orcid-account';
import { orcidOfUser } from '@/lib/users/orcid-of-user';
import { findUserByEmail, insertUser } from '@/lib/users/repo';
import { uniqueEmail } from '@/tests/support/unique';

const made = new Set<string>();
afterAll(async () => {
  const ids = [...made];
  await db()('audit_log').whereIn('actor_user_id', ids).delete();
  await db()('users').whereIn('id', ids).delete();
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

/** A fresh iD in the unissued 0000-0000 block with a valid check digit. */
function freshOrcid(): string {
  const base = `00000000${String(randomInt(0, 10_000_000)).padStart(7, '0')}`;
  return `${base}${orcidCheckDigit(base)}`.match(/.{4}/g)!.join('-');
}

async function localUser(opts: { verified: boolean; orcid?: string }) {
  const row = await insertUser({ email: uniqueEmail('orcid'), name: 'Hollis Quarrender', passwordHash: null, emailVerifiedAt: opts.verified ? new Date() : null });
  made.add(row.id);
  if (opts.orcid) await db()('users').where({ id: row.id }).update({ orcid: opts.orcid });
  return row;
}

async function refusal(promise: Promise<unknown>): Promise<string> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(OrcidSignInError);
  return (error as OrcidSignInError).refusal;
}

const accountsOf = (orcid: string) => db()('accounts').where({ provider: 'orcid', provider_account_id: orcid }).select('user_id', 'type');

describe('signing in with ORCID', () => {
  it('opens an account for a new researcher with no released e-mail, then recognises them', async () => {
    const orcid = freshOrcid();
    const first = await linkOrcidSignIn({ sub: orcid, givenName: 'Wynn', familyName: 'Harrowgate' }, { ip: '192.0.2.9' });
    made.add(first.userId);
    expect(first.outcome).toBe('created');
    const user = await db()('users').where({ id: first.userId }).first();
    expect(user).toMatchObject({ name: 'Wynn Harrowgate', email: placeholderEmail(orcid), orcid, email_verified_at: null, password_hash: null, site_role: 'user' });
    expect(await accountsOf(orcid)).toEqual([{ user_id: first.userId, type: 'oauth' }]);
    expect((await db()('audit_log').where({ action: 'user.sign_up', actor_user_id: first.userId }).first()).details).toEqual({ method: 'orcid', orcid });

    const again = await linkOrcidSignIn({ sub: `https://orcid.org/${orcid}`, name: 'Wynn Harrowgate' });
    expect(again).toEqual({ userId: first.userId, orcid, outcome: 'known' });
    expect(await accountsOf(orcid)).toHaveLength(1);
    expect(await orcidOfUser(first.userId)).toBe(orcid);
    const adapterUser = await knexAdapter().getUserByAccount!({ provider: 'orcid', providerAccountId: orcid });
    expect(adapterUser?.id).toBe(first.userId);
  });

  it('links to the account whose e-mail both sides have confirmed, and stores users.orcid', async () => {
    const local = await localUser({ verified: true });
    const orcid = freshOrcid();
    const result = await linkOrcidSignIn({ sub: orcid, name: 'Hollis Quarrender', email: local.email.toUpperCase(), emailVerified: true });
    expect(result).toEqual({ userId: local.id, orcid, outcome: 'linked_by_email' });
    expect(await orcidOfUser(local.id)).toBe(orcid);
    expect(await accountsOf(orcid)).toEqual([{ user_id: local.id, type: 'oauth' }]);
    const audit = await db()('audit_log').where({ action: 'user.orcid_linked', actor_user_id: local.id }).first();
    expect(audit.details).toEqual({ orcid, matchedBy: 'email' });
  });

  it('links to the account that already carries the iD in users.orcid', async () => {
    const orcid = freshOrcid();
    const local = await localUser({ verified: false, orcid });
    const result = await linkOrcidSignIn({ sub: orcid, email: 'someone.else@tidewater.example', emailVerified: true });
    expect(result).toEqual({ userId: local.id, orcid, outcome: 'linked_by_orcid' });
    expect(await accountsOf(orcid)).toEqual([{ user_id: local.id, type: 'oauth' }]);
  });

  it('does not link on an e-mail the provider has not confirmed: a separate account is opened', async () => {
    const local = await localUser({ verified: true });
    const orcid = freshOrcid();
    const result = await linkOrcidSignIn({ sub: orcid, name: 'Tamsin Orrery', email: local.email, emailVerified: false });
    made.add(result.userId);
    expect(result.outcome).toBe('created');
    expect(result.userId).not.toBe(local.id);
    expect((await findUserByEmail(local.email))?.orcid).toBeNull();
    expect((await db()('users').where({ id: result.userId }).first()).email).toBe(placeholderEmail(orcid));
  });

  it('refuses to link to an account that never confirmed its e-mail (no take-over by an unconfirmed sign-up)', async () => {
    const local = await localUser({ verified: false });
    const orcid = freshOrcid();
    expect(await refusal(linkOrcidSignIn({ sub: orcid, email: local.email, emailVerified: true }))).toBe('email_unconfirmed');
    expect(await accountsOf(orcid)).toEqual([]);
    expect((await findUserByEmail(local.email))?.orcid).toBeNull();
  });

  it('refuses when the e-mail’s account holds another iD, a disabled account, and a bad check digit', async () => {
    const other = freshOrcid();
    const local = await localUser({ verified: true, orcid: other });
    const orcid = freshOrcid();
    expect(await refusal(linkOrcidSignIn({ sub: orcid, email: local.email, emailVerified: true }))).toBe('orcid_conflict');
    expect(await orcidOfUser(local.id)).toBe(other);

    await db()('users').where({ id: local.id }).update({ disabled_at: new Date() });
    expect(await refusal(linkOrcidSignIn({ sub: other }))).toBe('account_disabled');

    const bad = orcid.slice(0, -1) + (orcid.endsWith('0') ? '1' : '0');
    expect(await refusal(linkOrcidSignIn({ sub: bad }))).toBe('invalid_orcid');
    expect(await refusal(linkOrcidSignIn({ sub: 'ada@larkspur.example' }))).toBe('invalid_orcid');
  });
});
