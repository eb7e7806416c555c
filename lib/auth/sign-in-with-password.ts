import 'server-only';
import { findUserByEmail } from '@/lib/users/repo';
import { isLimited, recordHit, resetLimit, SIGN_IN_PER_ACCOUNT, SIGN_IN_PER_IP } from '@/lib/rate-limit/rate-limit';
import { recordAudit } from '@/lib/audit/record-audit';
import { hashPassword, verifyPassword } from './password';

export class TooManyAttemptsError extends Error {
  constructor() {
    super('Too many sign-in attempts. Wait 15 minutes, or use an e-mail sign-in link.');
  }
}

let dummyHash: Promise<string> | undefined;

/** Checks an e-mail and password; throttled per address and per IP. Returns the user for next-auth, or null. */
export async function signInWithPassword({ email, password, ip }: { email: string; password: string; ip: string }) {
  const address = email.trim().toLowerCase();
  if (!address || !password) return null;
  if ((await isLimited(SIGN_IN_PER_ACCOUNT, address)) || (await isLimited(SIGN_IN_PER_IP, ip))) {
    await recordAudit({ action: 'user.sign_in_throttled', actorKind: 'anonymous', ip, details: { reason: 'rate limit' } });
    throw new TooManyAttemptsError();
  }
  const user = await findUserByEmail(address);
  // Verify against a dummy hash for unknown users so timing does not reveal which addresses exist.
  dummyHash ??= hashPassword('not-a-real-password-for-timing');
  const ok = await verifyPassword(user?.password_hash ?? (await dummyHash), password);
  if (!user || !user.password_hash || !ok || user.disabled_at) {
    await recordHit(SIGN_IN_PER_ACCOUNT, address);
    await recordHit(SIGN_IN_PER_IP, ip);
    await recordAudit({ action: 'user.sign_in_failed', actorKind: 'anonymous', actorUserId: user?.id ?? null, ip });
    return null;
  }
  await resetLimit(SIGN_IN_PER_ACCOUNT, address);
  return { id: user.id, email: user.email, name: user.name, siteRole: user.site_role };
}
