import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { db } from '@/lib/db';
import type { UserRow } from './repo';

export const ORCID_PROVIDER = 'orcid';

export async function findUserIdByOrcidAccount(orcid: string): Promise<string | undefined> {
  const row = await db()('accounts').where({ provider: ORCID_PROVIDER, provider_account_id: orcid }).first('user_id');
  return row?.user_id;
}

export async function findUserByOrcid(orcid: string): Promise<UserRow | undefined> {
  return db()<UserRow>('users').where({ orcid }).first();
}

export async function findOrcidOfUser(userId: string): Promise<string | null> {
  const row = await db()('users').where({ id: userId }).first('orcid');
  return row?.orcid ?? null;
}

async function insertOrcidAccount(trx: Knex.Transaction, userId: string, orcid: string): Promise<void> {
  await trx('accounts').insert({ id: randomUUID(), user_id: userId, provider: ORCID_PROVIDER, provider_account_id: orcid, type: 'oauth' });
}

/** Links the iD to an existing user: an accounts row, and users.orcid where it is still empty (one transaction). */
export async function linkOrcidToUser(userId: string, orcid: string): Promise<void> {
  await db().transaction(async (trx) => {
    const linked = await trx('accounts').where({ provider: ORCID_PROVIDER, provider_account_id: orcid }).first('user_id');
    if (!linked) await insertOrcidAccount(trx, userId, orcid);
    await trx('users').where({ id: userId }).whereNull('orcid').update({ orcid, updated_at: new Date() });
  });
}

/** A new user who signed in with ORCID, with the iD linked (one transaction). */
export async function insertUserWithOrcid(user: { email: string; name: string; orcid: string; emailVerifiedAt: Date | null }): Promise<string> {
  const id = randomUUID();
  await db().transaction(async (trx) => {
    await trx('users').insert({
      id, email: user.email.toLowerCase(), name: user.name, password_hash: null, site_role: 'user', orcid: user.orcid,
      email_verified_at: user.emailVerifiedAt,
    });
    await insertOrcidAccount(trx, id, user.orcid);
  });
  return id;
}
