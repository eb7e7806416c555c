'use client';

import Link from 'next/link';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';

export type NewPasswordFormProps = { token: string; action: (prev: ActionState, form: FormData) => Promise<ActionState> };

export function NewPasswordForm({ token, action }: NewPasswordFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  if (state?.ok) {
    return <Notice tone="success">Your password is changed. <Link href="/sign-in" className="underline">Sign in</Link> with the new one.</Notice>;
  }
  return (
    <form action={formAction} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" noValidate>
      {state && !state.ok && <Notice tone="error">{state.error}</Notice>}
      <input type="hidden" name="token" value={token} />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters." error={state && !state.ok ? state.fieldErrors?.password : undefined} />
      <Button type="submit" disabled={pending}>Set new password</Button>
    </form>
  );
}
