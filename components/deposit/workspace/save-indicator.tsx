'use client';

import { formatClockTime } from '@/lib/format/date-time';
import type { SaveState } from './use-autosave';

/** Where the author's changes are: saved (with the time and zone), waiting, being sent, or kept here after a failure. */
export function SaveIndicator({ state, canEdit }: { state: SaveState; canEdit: boolean }) {
  if (!canEdit) return <p className="text-sm text-slate-600">Read only: you can view this draft but not change it.</p>;
  const text =
    state.status === 'saving' ? 'Saving…'
      : state.status === 'pending' ? 'Changes not saved yet…'
        : state.status === 'error' ? 'Not saved'
          : state.savedAt ? `Saved at ${formatClockTime(state.savedAt)}` : 'All changes saved';
  const tone = state.status === 'error' ? 'text-red-800' : state.status === 'saved' ? 'text-emerald-800' : 'text-slate-700';
  return (
    <div className="text-sm" aria-live="polite">
      <p className={`font-medium ${tone}`} data-testid="save-status">
        <span aria-hidden="true" className="mr-1">{state.status === 'saved' ? '✓' : state.status === 'error' ? '!' : '…'}</span>
        {text}
      </p>
      {state.status === 'error' && state.message && <p role="alert" className="max-w-md text-xs text-red-800">{state.message}</p>}
    </div>
  );
}
