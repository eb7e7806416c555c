'use client';

import type { ReactNode } from 'react';

/** Look of every control, without a width (callers size it). */
export const INPUT_BASE = 'rounded-md border bg-white px-3 py-2 text-sm text-slate-900 shadow-sm disabled:bg-slate-100 disabled:text-slate-500';
export const INPUT_CLASS = `w-full ${INPUT_BASE}`;

export function inputBorder(error?: string): string {
  return error ? 'border-red-600' : 'border-slate-400';
}

/** ids of the hint and error paragraphs a control is described by. */
export function describedBy(id: string, hint?: string, error?: string): string | undefined {
  return [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
}

export type FieldFrameProps = {
  id: string;
  label: string;
  required?: boolean;
  hint?: string;
  error?: string;
  children: ReactNode;
  className?: string;
};

/** Label, control, hint and error of one field; the error is tied to the control and announced. */
export function FieldFrame({ id, label, required, hint, error, children, className = '' }: FieldFrameProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-medium text-slate-800">
        {label}
        {required && <span className="ml-1 text-xs font-normal text-slate-500">(required)</span>}
      </label>
      {children}
      {hint && <p id={`${id}-hint`} className="text-xs text-slate-600">{hint}</p>}
      <FieldError id={id} error={error} />
    </div>
  );
}

export function FieldError({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return <p id={`${id}-error`} role="alert" className="text-sm text-red-700">{error}</p>;
}
