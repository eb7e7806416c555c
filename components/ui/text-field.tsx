import type { InputHTMLAttributes } from 'react';

export type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string; hint?: string };

/** A labelled input whose error is announced and tied to the field (aria-describedby). */
export function TextField({ label, name, error, hint, id, className = '', ...props }: TextFieldProps) {
  const inputId = id ?? `field-${name}`;
  const described = [hint ? `${inputId}-hint` : '', error ? `${inputId}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-sm font-medium text-slate-800">{label}</label>
      <input
        id={inputId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={described}
        className={`rounded-md border bg-white px-3 py-2 text-slate-900 shadow-sm ${error ? 'border-red-600' : 'border-slate-400'}`}
        {...props}
      />
      {hint && <p id={`${inputId}-hint`} className="text-xs text-slate-600">{hint}</p>}
      {error && <p id={`${inputId}-error`} className="text-sm text-red-700">{error}</p>}
    </div>
  );
}
