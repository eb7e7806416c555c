import 'server-only';
import signUpSchema from '@/schemas/sign-up.schema.json';
import { AppError } from '@/lib/errors';
import { hashPassword, passwordProblem } from '@/lib/auth/password';
import { validateWith } from '@/lib/validation/validate';
import { recordAudit } from '@/lib/audit/record-audit';
import { findUserByEmail, insertUser, type UserRow } from './repo';

export type SignUpInput = { name: string; email: string; password: string };

/** Creates an account with a password; field errors (and nothing stored) on bad input. */
export async function registerUser(input: unknown): Promise<UserRow> {
  const parsed = validateWith<SignUpInput>(signUpSchema, input);
  if (!parsed.ok) throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors: parsed.fieldErrors });
  const { name, password } = parsed.value;
  const email = parsed.value.email.trim().toLowerCase();
  const weak = passwordProblem(password, email);
  if (weak) throw new AppError('validation_failed', 'Please choose a stronger password.', { fieldErrors: { password: weak } });
  if (await findUserByEmail(email)) {
    throw new AppError('conflict', 'An account with this e-mail address already exists.', {
      fieldErrors: { email: 'An account with this address exists. Sign in, or reset the password.' },
    });
  }
  const user = await insertUser({ email, name: name.trim(), passwordHash: await hashPassword(password) });
  await recordAudit({ action: 'user.sign_up', actorKind: 'user', actorUserId: user.id, targetType: 'user', targetId: user.id });
  return user;
}
