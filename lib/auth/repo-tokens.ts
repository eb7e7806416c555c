import 'server-only';
import { db } from '@/lib/db';

export type TokenPurpose = 'sign_in' | 'password_reset';

export async function insertVerificationToken(t: { identifier: string; tokenHash: string; purpose: TokenPurpose; expiresAt: Date }): Promise<void> {
  await db()('verification_tokens').insert({ identifier: t.identifier, token_hash: t.tokenHash, purpose: t.purpose, expires_at: t.expiresAt });
}

/** Deletes and returns the token in one transaction so a link works once. */
export async function consumeVerificationToken(tokenHash: string, purpose: TokenPurpose, identifier?: string) {
  return db().transaction(async (trx) => {
    const q = trx('verification_tokens').where({ token_hash: tokenHash, purpose }).forUpdate();
    if (identifier) q.andWhere({ identifier });
    const row = (await q.first()) as { identifier: string; token_hash: string; expires_at: Date } | undefined;
    if (!row) return undefined;
    await trx('verification_tokens').where({ token_hash: tokenHash }).delete();
    return row;
  });
}
