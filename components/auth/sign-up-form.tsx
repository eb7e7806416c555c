'use client';

import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';

export type SignUpFormProps = { action: (prev: ActionState, form: FormData) => Promise<ActionState> };

export function SignUpForm({ action }: SignUpFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : undefined;
  return (
    <form action={formAction} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" noValidate>
      {failed && <Notice tone="error">{failed.error}</Notice>}
      <TextField label="Name" name="name" autoComplete="name" required defaultValue={failed?.values?.name} error={failed?.fieldErrors?.name} />
      <TextField label="E-mail address" name="email" type="email" autoComplete="email" required defaultValue={failed?.values?.email} error={failed?.fieldErrors?.email} />
      <TextField label="Password" name="password" type="password" autoComplete="new-password" required
        hint="At least 10 characters; a passphrase of several words works well." error={failed?.fieldErrors?.password} />
      <Button type="submit" disabled={pending}>{pending ? 'Creating account…' : 'Create account'}</Button>
    </form>
  );
}
