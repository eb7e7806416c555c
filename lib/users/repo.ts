import 'server-only';
import { randomUUID } from 'node:crypto';
import { db } from '@/lib/db';
import type { SiteRole } from '@/lib/access';

export type UserRow = {
  id: string;
  email: string;
  name: string;
  password_hash: string | null;
  site_role: SiteRole;
  orcid: string | null;
  affiliation: string | null;
  email_verified_at: Date | null;
  disabled_at: Date | null;
  created_at: Date;
};

export async function findUserByEmail(email: string): Promise<UserRow | undefined> {
  return db()<UserRow>('users').where({ email: email.toLowerCase() }).first();
}

export async function findUserById(id: string): Promise<UserRow | undefined> {
  return db()<UserRow>('users').where({ id }).first();
}

export async function insertUser(user: {
  email: string;
  name: string;
  passwordHash: string | null;
  siteRole?: SiteRole;
  emailVerifiedAt?: Date | null;
}): Promise<UserRow> {
  const id = randomUUID();
  await db()('users').insert({
    id,
    email: user.email.toLowerCase(),
    name: user.name,
    password_hash: user.passwordHash,
    site_role: user.siteRole ?? 'user',
    email_verified_at: user.emailVerifiedAt ?? null,
  });
  const row = await findUserById(id);
  if (!row) throw new Error('user vanished after insert');
  return row;
}

export async function updateUser(id: string, patch: Partial<Pick<UserRow, 'name' | 'password_hash' | 'email_verified_at' | 'orcid'>>): Promise<void> {
  await db()('users').where({ id }).update({ ...patch, updated_at: new Date() });
}
