'use server';

import { formValues, runAction, type ActionState } from '@/lib/http/action';
import { requestPasswordReset, resetPassword } from '@/lib/auth/password-reset';

export async function requestResetAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const { email } = formValues(form, ['email']);
  return runAction(() => requestPasswordReset(email), { email });
}

export async function resetPasswordAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const { token, password } = formValues(form, ['token', 'password']);
  return runAction(() => resetPassword(token, password));
}
