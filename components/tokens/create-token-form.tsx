'use client';

import { useActionState } from 'react';
import { useFormStatus } from 'react-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';
import { SCOPE_DESCRIPTIONS, TOKEN_SCOPES } from '@/lib/tokens/scopes';
import { NewTokenNotice } from './new-token-notice';

export type CreatedTokenData = { name: string; token: string };
export type CreateTokenFormProps = {
  action: (prev: ActionState<CreatedTokenData>, form: FormData) => Promise<ActionState<CreatedTokenData>>;
};

export const EXPIRY_CHOICES = [
  { value: '7', label: '7 days' },
  { value: '30', label: '30 days' },
  { value: '90', label: '90 days' },
  { value: '365', label: '1 year' },
  { value: 'never', label: 'Never (not recommended)' },
];

function Submit() {
  const { pending } = useFormStatus();
  return <Button type="submit" disabled={pending}>{pending ? 'Creating…' : 'Create token'}</Button>;
}

/** Name, scopes and expiry; on success the secret is shown once above the form. */
export function CreateTokenForm({ action }: CreateTokenFormProps) {
  const [state, formAction] = useActionState<ActionState<CreatedTokenData>, FormData>(action, null);
  const failed = state && !state.ok ? state : null;
  const created = state?.ok ? state.data : undefined;
  const chosen = failed?.values?.scopes?.split(',') ?? ['read'];
  return (
    <div className="flex flex-col gap-4">
      {created && <NewTokenNotice name={created.name} token={created.token} />}
      <form action={formAction} className="flex flex-col gap-4 rounded-lg border border-slate-200 bg-white p-6" aria-labelledby="new-token-heading" noValidate>
        <h2 id="new-token-heading" className="text-lg font-semibold">New token</h2>
        {failed && <Notice tone="error">{failed.error}</Notice>}
        <TextField
          label="Name"
          name="name"
          required
          maxLength={120}
          defaultValue={failed?.values?.name}
          error={failed?.fieldErrors?.name}
          hint="What it is for, e.g. “cryostat PC upload script”."
        />
        <fieldset aria-describedby={failed?.fieldErrors?.scopes ? 'scopes-error' : undefined}>
          <legend className="text-sm font-medium text-slate-800">Scopes</legend>
          <div className="mt-2 flex flex-col gap-2">
            {TOKEN_SCOPES.map((scope) => (
              <label key={scope} className="flex items-start gap-2 text-sm">
                <input type="checkbox" name="scopes" value={scope} defaultChecked={chosen.includes(scope)} className="mt-1" />
                <span><span className="font-mono font-semibold">{scope}</span> — {SCOPE_DESCRIPTIONS[scope]}</span>
              </label>
            ))}
          </div>
          {failed?.fieldErrors?.scopes && <p id="scopes-error" className="mt-1 text-sm text-red-700">{failed.fieldErrors.scopes}</p>}
        </fieldset>
        <div className="flex flex-col gap-1">
          <label htmlFor="field-expiry" className="text-sm font-medium text-slate-800">Expires after</label>
          <select id="field-expiry" name="expiry" defaultValue={failed?.values?.expiry || '90'} className="w-56 rounded-md border border-slate-400 bg-white px-3 py-2 text-slate-900 shadow-sm">
            {EXPIRY_CHOICES.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
          </select>
        </div>
        <div><Submit /></div>
      </form>
    </div>
  );
}
