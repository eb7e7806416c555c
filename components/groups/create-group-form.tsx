'use client';

import { useActionState } from 'react';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';
import { SubmitButton, type GroupAction } from './action-form';

export type CreateGroupFormProps = { action: GroupAction };

/** Name (required), address, institution and description; the address is made from the name when left empty. */
export function CreateGroupForm({ action }: CreateGroupFormProps) {
  const [state, formAction] = useActionState<ActionState, FormData>(action, null);
  const failed = state && !state.ok ? state : null;
  const descriptionError = failed?.fieldErrors?.description;
  return (
    <form action={formAction} className="flex flex-col gap-5 rounded-lg border border-slate-200 bg-white p-6" noValidate>
      {failed && <Notice tone="error">{failed.error}</Notice>}
      <TextField label="Group name" name="name" required minLength={3} maxLength={200} defaultValue={failed?.values?.name} error={failed?.fieldErrors?.name}
        hint="As colleagues know it, e.g. “Tidewater Thin Films Group”." />
      <TextField label="Address (optional)" name="slug" maxLength={80} defaultValue={failed?.values?.slug} error={failed?.fieldErrors?.slug}
        hint="Shown as /groups/your-address: lower-case letters, digits and hyphens. Left empty, it is made from the name." autoCapitalize="off" spellCheck={false} />
      <TextField label="Institution (optional)" name="institution" maxLength={300} defaultValue={failed?.values?.institution} error={failed?.fieldErrors?.institution} />
      <div className="flex flex-col gap-1">
        <label htmlFor="field-description" className="text-sm font-medium text-slate-800">Description (optional)</label>
        <textarea id="field-description" name="description" rows={3} maxLength={2000} defaultValue={failed?.values?.description}
          aria-invalid={descriptionError ? true : undefined} aria-describedby={descriptionError ? 'field-description-error field-description-hint' : 'field-description-hint'}
          className={`rounded-md border bg-white px-3 py-2 text-slate-900 shadow-sm ${descriptionError ? 'border-red-600' : 'border-slate-400'}`} />
        <p id="field-description-hint" className="text-xs text-slate-600">What the group measures, in a sentence or two. Shown on the group page.</p>
        {descriptionError && <p id="field-description-error" className="text-sm text-red-700">{descriptionError}</p>}
      </div>
      <div><SubmitButton pendingText="Creating…">Create the group</SubmitButton></div>
    </form>
  );
}
