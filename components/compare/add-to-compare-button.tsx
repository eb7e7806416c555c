'use client';

import Link from 'next/link';
import { useState } from 'react';
import type { CurveRefInput } from '@/lib/compare/types';
import { addToAccount, addToLocalBasket, CompareApiError, resolveRefs } from './basket-client';

export type AddToCompareButtonProps = CurveRefInput & {
  /** Button text; the default names the action plainly. */
  label?: string;
  className?: string;
};

type State = { kind: 'idle' } | { kind: 'busy' } | { kind: 'done'; text: string } | { kind: 'error'; text: string };

/**
 * Puts a curve in the compare basket: the account's when signed in, else this browser's (merged into the account at
 * the next signed-in visit of /compare). A version alone adds its main curve; give fileId, x and y for a specific one.
 */
export function AddToCompareButton({ label = 'Add to compare', className = '', ...ref }: AddToCompareButtonProps) {
  const [state, setState] = useState<State>({ kind: 'idle' });

  async function add() {
    setState({ kind: 'busy' });
    try {
      let outcome: 'added' | 'present';
      let count: number;
      try {
        const r = await addToAccount(ref);
        outcome = r.items[0]?.outcome ?? 'present';
        count = r.count;
      } catch (error) {
        if (!(error instanceof CompareApiError) || error.status !== 401) throw error;
        // Not signed in: the server still picks and checks the curve, the browser keeps the reference.
        const resolved = await resolveRefs([ref]);
        const entry = resolved.entries[0];
        if (!entry?.ref) throw new CompareApiError(404, 'not_found', resolved.unavailable[0]?.message ?? 'This curve cannot be compared.');
        ({ outcome, count } = addToLocalBasket(entry.ref));
      }
      setState({ kind: 'done', text: `${outcome === 'added' ? 'Added' : 'Already in the basket'} · ${count} curve${count === 1 ? '' : 's'}` });
    } catch (error) {
      setState({ kind: 'error', text: error instanceof Error ? error.message : 'The curve could not be added.' });
    }
  }

  return (
    <div className={`flex flex-wrap items-center gap-x-3 gap-y-1 ${className}`}>
      <button
        type="button"
        onClick={add}
        disabled={state.kind === 'busy'}
        className="inline-flex items-center gap-2 rounded-md border border-copper-600 bg-white px-3 py-1.5 text-sm font-semibold text-copper-700 transition-colors hover:bg-copper-50 disabled:cursor-wait disabled:opacity-70"
      >
        <svg aria-hidden="true" width="16" height="16" viewBox="0 0 16 16" fill="none" stroke="currentColor" strokeWidth="1.6">
          <path d="M1 12 C4 11 5 4 8 4 S12 9 15 8" />
          <path d="M1 14 C5 13 6 8 9 8 S13 11 15 11" strokeDasharray="2 2" />
        </svg>
        {state.kind === 'busy' ? 'Adding…' : label}
      </button>
      <span role="status" aria-live="polite" className="text-sm">
        {state.kind === 'done' && (
          <span className="text-slate-700">
            {state.text} · <Link href="/compare" className="font-medium text-copper-700 underline underline-offset-2">Open Compare</Link>
          </span>
        )}
        {state.kind === 'error' && <span className="text-red-800">{state.text}</span>}
      </span>
    </div>
  );
}
