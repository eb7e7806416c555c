'use client';

import { useActionState, type ReactNode } from 'react';
import { useFormStatus } from 'react-dom';
import { Button, type ButtonProps } from '@/components/ui/button';
import type { ActionState } from '@/lib/http/action';

export type GroupAction = (prev: ActionState, form: FormData) => Promise<ActionState>;

export type ActionFormProps = {
  action: GroupAction;
  children: ReactNode;
  className?: string;
  /** Shown in a live region after success (the page also re-renders with the change). */
  successText?: string;
  /** Accessible name of the form, e.g. "Role of Ada Penhallow". */
  label?: string;
};

export type SubmitButtonProps = ButtonProps & { pendingText: string };

/** A submit button that says what is happening while the server action runs. */
export function SubmitButton({ pendingText, children, ...props }: SubmitButtonProps) {
  const { pending } = useFormStatus();
  return <Button type="submit" disabled={pending || props.disabled} aria-disabled={pending || undefined} {...props}>{pending ? pendingText : children}</Button>;
}

/** A form bound to one server action; its refusal (or success) is announced right under the controls. */
export function ActionForm({ action, children, className = '', successText, label }: ActionFormProps) {
  const [state, formAction] = useActionState<ActionState, FormData>(action, null);
  return (
    <form action={formAction} className={className} aria-label={label} noValidate>
      {children}
      <div aria-live="polite" className="basis-full">
        {state && !state.ok && <p role="alert" className="mt-1 text-sm text-red-700">{state.error}</p>}
        {state?.ok && (state.message ?? successText) && <p className="mt-1 text-sm text-emerald-800">{state.message ?? successText}</p>}
      </div>
    </form>
  );
}
