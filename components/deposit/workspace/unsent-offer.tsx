'use client';

import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format/date-time';
import type { UnsentEdit } from './unsent-store';

/** A copy of edits this browser never got saved, older than a later save on the server: the author chooses. */
export function UnsentOffer({ offered, onRestore, onDiscard }: { offered: UnsentEdit; onRestore: () => void; onDiscard: () => void }) {
  return (
    <div role="alert" className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-sm text-amber-950">
      <p className="font-semibold">This browser kept changes that were never saved</p>
      <p className="mt-1">
        They were made at {formatDateTime(new Date(offered.editedAt))}; the draft has been saved since (perhaps by a co-author).
        Restore them to replace the saved record, or discard them.
      </p>
      <div className="mt-3 flex gap-2">
        <Button type="button" onClick={onRestore}>Restore my changes</Button>
        <Button type="button" variant="secondary" onClick={onDiscard}>Discard them</Button>
      </div>
    </div>
  );
}
