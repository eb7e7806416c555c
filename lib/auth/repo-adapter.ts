import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Adapter, AdapterAccount, AdapterUser } from 'next-auth/adapters';
import { db } from '@/lib/db';
import type { UserRow } from '@/lib/users/repo';
import { consumeVerificationToken, insertVerificationToken } from './repo-tokens';

// next-auth adapter over our own tables: users, accounts (OIDC links) and verification_tokens.
// Sessions are JWTs, so the session methods are not needed.

function toAdapterUser(row: UserRow): AdapterUser {
  return { id: row.id, email: row.email, name: row.name, emailVerified: row.email_verified_at, siteRole: row.site_role };
}

async function userBy(where: Partial<UserRow>): Promise<AdapterUser | null> {
  const row = await db()<UserRow>('users').where(where).whereNull('disabled_at').first();
  return row ? toAdapterUser(row) : null;
}

export function knexAdapter(): Adapter {
  return {
    async createUser(user: Omit<AdapterUser, 'id'>) {
      const id = randomUUID();
      const email = user.email.toLowerCase();
      await db()('users').insert({ id, email, name: user.name ?? email.split('@')[0], email_verified_at: user.emailVerified ?? null });
      return (await userBy({ id }))!;
    },
    getUser: (id) => userBy({ id }),
    getUserByEmail: (email) => userBy({ email: email.toLowerCase() }),
    async getUserByAccount({ provider, providerAccountId }) {
      const acc = await db()('accounts').where({ provider, provider_account_id: providerAccountId }).first('user_id');
      return acc ? userBy({ id: acc.user_id }) : null;
    },
    async updateUser(user) {
      const patch: Record<string, unknown> = { updated_at: new Date() };
      if (user.name) patch.name = user.name;
      if (user.emailVerified !== undefined) patch.email_verified_at = user.emailVerified;
      await db()('users').where({ id: user.id }).update(patch);
      return (await userBy({ id: user.id }))!;
    },
    async linkAccount(account: AdapterAccount) {
      await db()('accounts').insert({
        id: randomUUID(), user_id: account.userId, provider: account.provider,
        provider_account_id: account.providerAccountId, type: account.type,
      });
    },
    async createVerificationToken(token) {
      // next-auth hands us the token already hashed with the secret.
      await insertVerificationToken({ identifier: token.identifier, tokenHash: token.token, purpose: 'sign_in', expiresAt: token.expires });
      return token;
    },
    async useVerificationToken({ identifier, token }) {
      const row = await consumeVerificationToken(token, 'sign_in', identifier);
      return row ? { identifier: row.identifier, token: row.token_hash, expires: new Date(row.expires_at) } : null;
    },
  };
}
