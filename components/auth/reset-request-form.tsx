'use client';

import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';

export type ResetRequestFormProps = { action: (prev: ActionState, form: FormData) => Promise<ActionState> };

export function ResetRequestForm({ action }: ResetRequestFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  if (state?.ok) {
    return <Notice tone="success">If an account uses that address, a reset link is on its way. It works once, for 30 minutes.</Notice>;
  }
  return (
    <form action={formAction} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" noValidate>
      {state && !state.ok && <Notice tone="error">{state.error}</Notice>}
      <TextField label="E-mail address" name="email" type="email" autoComplete="email" required defaultValue={state && !state.ok ? state.values?.email : undefined} error={state && !state.ok ? state.fieldErrors?.email : undefined} />
      <Button type="submit" disabled={pending}>Send reset link</Button>
    </form>
  );
}
