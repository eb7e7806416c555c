import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';
import { sendMail } from '@/lib/mail/send-mail';
import { findUserByEmail, findUserById, updateUser } from '@/lib/users/repo';
import { isLimited, MAIL_PER_ADDRESS, recordHit } from '@/lib/rate-limit/rate-limit';
import { recordAudit } from '@/lib/audit/record-audit';
import { hashPassword, passwordProblem } from './password';
import { consumeVerificationToken, insertVerificationToken } from './repo-tokens';

const RESET_TTL_MS = 30 * 60_000;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

/** Sends a reset link if the account exists; the answer is the same either way so addresses cannot be probed. */
export async function requestPasswordReset(emailInput: string): Promise<void> {
  const email = emailInput.trim().toLowerCase();
  if (!/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(email)) {
    throw new AppError('validation_failed', 'Enter a valid e-mail address.', { fieldErrors: { email: 'Enter a valid e-mail address.' } });
  }
  if (await isLimited(MAIL_PER_ADDRESS, email)) return;
  await recordHit(MAIL_PER_ADDRESS, email);
  const user = await findUserByEmail(email);
  if (!user || user.disabled_at) return;
  const token = randomBytes(32).toString('base64url');
  await insertVerificationToken({ identifier: user.id, tokenHash: sha256(token), purpose: 'password_reset', expiresAt: new Date(Date.now() + RESET_TTL_MS) });
  const url = `${env().NEXTAUTH_URL}/reset-password/${token}`;
  await sendMail({
    to: user.email,
    subject: 'Reset your Ohmstead password',
    text: `Someone asked to reset the password of your Ohmstead account.\n\nChoose a new password here (the link works once, for 30 minutes):\n\n${url}\n\nIf it was not you, ignore this message; your password is unchanged.`,
  });
  await recordAudit({ action: 'user.password_reset_requested', actorKind: 'anonymous', targetType: 'user', targetId: user.id });
}

export async function resetPassword(token: string, newPassword: string): Promise<void> {
  const row = await consumeVerificationToken(sha256(token), 'password_reset');
  if (!row || new Date(row.expires_at).getTime() < Date.now()) {
    throw new AppError('not_found', 'This reset link has expired or was already used. Ask for a new one.');
  }
  const user = await findUserById(row.identifier);
  if (!user) throw new AppError('not_found', 'This reset link has expired or was already used. Ask for a new one.');
  const weak = passwordProblem(newPassword, user.email);
  if (weak) {
    // Put the token back so the user can try again with a stronger password.
    await insertVerificationToken({ identifier: row.identifier, tokenHash: row.token_hash, purpose: 'password_reset', expiresAt: new Date(row.expires_at) });
    throw new AppError('validation_failed', 'Please choose a stronger password.', { fieldErrors: { password: weak } });
  }
  await updateUser(user.id, { password_hash: await hashPassword(newPassword) });
  await recordAudit({ action: 'user.password_reset', actorKind: 'user', actorUserId: user.id, targetType: 'user', targetId: user.id });
}
