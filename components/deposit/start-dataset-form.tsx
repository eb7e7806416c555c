'use client';

import { useActionState } from 'react';
import { useFormStatus } from 'react-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import type { ActionState } from '@/lib/http/action';

export type StartDatasetFormProps<T> = {
  action: (prev: ActionState<T>, form: FormData) => Promise<ActionState<T>>;
  groups: { slug: string; name: string }[];
};

function Submit() {
  const { pending } = useFormStatus();
  return <Button type="submit" disabled={pending}>{pending ? 'Starting…' : 'Start the dataset'}</Button>;
}

/** Group and title: enough to create draft version 1 and reserve its DOI. */
export function StartDatasetForm<T>({ action, groups }: StartDatasetFormProps<T>) {
  const [state, formAction] = useActionState<ActionState<T>, FormData>(action, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="mt-4 grid gap-4 md:grid-cols-[16rem_1fr_auto] md:items-start" noValidate>
      {failed && <div className="md:col-span-3"><Notice tone="error">{failed.error}</Notice></div>}
      <div className="flex flex-col gap-1">
        <label htmlFor="field-group" className="text-sm font-medium text-slate-800">Group</label>
        <select
          id="field-group"
          name="group"
          defaultValue={failed?.values?.group || groups[0]?.slug}
          aria-invalid={failed?.fieldErrors?.group ? true : undefined}
          aria-describedby={failed?.fieldErrors?.group ? 'field-group-error' : undefined}
          className="rounded-md border border-slate-400 bg-white px-3 py-2 text-slate-900 shadow-sm"
        >
          {groups.map((g) => <option key={g.slug} value={g.slug}>{g.name}</option>)}
        </select>
        {failed?.fieldErrors?.group && <p id="field-group-error" className="text-sm text-red-700">{failed.fieldErrors.group}</p>}
      </div>
      <TextField
        label="Title"
        name="title"
        required
        maxLength={300}
        defaultValue={failed?.values?.title}
        error={failed?.fieldErrors?.title}
        hint="What was measured on what, e.g. “R(T) of annealed Cu wire, 2–300 K”. You can change it later."
      />
      <div className="md:pt-6"><Submit /></div>
    </form>
  );
}
