'use server';

import { redirect } from 'next/navigation';
import { formValues, runAction, type ActionState } from '@/lib/http/action';
import { registerUser } from '@/lib/users/register-user';

export async function signUpAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formValues(form, ['name', 'email', 'password']);
  const result = await runAction(async () => {
    await registerUser(values);
  }, { name: values.name, email: values.email });
  if (result?.ok) redirect('/sign-in?created=1');
  return result;
}
