'use client';

import { Button } from '@/components/ui/button';
import type { Suggestion } from './prefill';

/** What the files already tell for empty fields, filled in only when the author says so. */
export function SuggestionsBox({ suggestions, onApply, readOnly }: { suggestions: Suggestion[]; onApply: () => void; readOnly: boolean }) {
  if (suggestions.length === 0 || readOnly) return null;
  return (
    <section aria-labelledby="suggestions-heading" className="rounded-lg border border-copper-200 bg-copper-50 p-4">
      <h3 id="suggestions-heading" className="font-semibold text-copper-900">The files already say this</h3>
      <ul className="mt-2 grid gap-1 text-sm text-slate-800 sm:grid-cols-2">
        {suggestions.map((s) => (
          <li key={s.path.join('.')}>
            <span className="font-medium">{s.field}:</span> <span className="num">{s.text}</span>{' '}
            <span className="text-xs text-slate-600">(from {s.from})</span>
          </li>
        ))}
      </ul>
      <Button type="button" className="mt-3" onClick={onApply}>Fill these in</Button>
      <p className="mt-2 text-xs text-slate-600">Only empty fields are filled; check them before you submit.</p>
    </section>
  );
}
