'use client';

import { useActionState } from 'react';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { GroupRole } from '@/lib/access';
import type { ActionState } from '@/lib/http/action';
import { SubmitButton, type GroupAction } from './action-form';

export type InviteFormProps = { action: GroupAction; slug: string; roles: GroupRole[] };

const ROLE_HINTS: Record<GroupRole, string> = {
  member: 'member: deposits datasets',
  curator: 'curator: also reviews and publishes',
  owner: 'owner: also manages members',
};

/** E-mail address and role; the invitation mail carries a link valid for 14 days. */
export function InviteForm({ action, slug, roles }: InviteFormProps) {
  const [state, formAction] = useActionState<ActionState, FormData>(action, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="grid grid-cols-[minmax(0,1fr)] gap-4 md:grid-cols-[minmax(0,1fr)_18rem_auto] md:items-start" noValidate aria-labelledby="invite-heading">
      <input type="hidden" name="slug" value={slug} />
      <div aria-live="polite" className="md:col-span-3 empty:hidden">
        {failed && <Notice tone="error">{failed.error}</Notice>}
        {state?.ok && state.message && <Notice tone="success">{state.message}</Notice>}
      </div>
      <TextField label="E-mail address" name="email" type="email" autoComplete="off" required defaultValue={failed?.values?.email} error={failed?.fieldErrors?.email}
        hint="They accept by signing in with this address." />
      <div className="flex min-w-0 flex-col gap-1">
        <label htmlFor="field-invite-role" className="text-sm font-medium text-slate-800">Role</label>
        <select id="field-invite-role" name="role" defaultValue={failed?.values?.role || 'member'}
          aria-invalid={failed?.fieldErrors?.role ? true : undefined} aria-describedby={failed?.fieldErrors?.role ? 'field-invite-role-error' : undefined}
          className="w-full min-w-0 rounded-md border border-slate-400 bg-white px-3 py-2 text-slate-900 shadow-sm">
          {roles.map((r) => <option key={r} value={r}>{ROLE_HINTS[r]}</option>)}
        </select>
        {failed?.fieldErrors?.role && <p id="field-invite-role-error" className="text-sm text-red-700">{failed.fieldErrors.role}</p>}
      </div>
      <div className="md:pt-6"><SubmitButton pendingText="Sending…">Send invitation</SubmitButton></div>
    </form>
  );
}
