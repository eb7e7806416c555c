'use client';

import { DerivedPanel } from '@/components/deposit/derived/derived-panel';
import type { SummarySource } from './summary-sources';

/** Derived values and quality flags of each analysed (or instantly previewed) file. */
export function DerivedSection({ sources }: { sources: SummarySource[] }) {
  if (sources.length === 0) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-sm text-slate-600">
        Nothing to compute yet. Once a table is analysed, resistivity, sheet resistance, RRR, Hall quantities and the noise
        level appear here as far as the record allows (the geometry is what most of them need).
      </p>
    );
  }
  return (
    <div className="grid gap-4">
      {sources.map((s) => <DerivedPanel key={s.key} fileLabel={s.label} summary={s.summary} note={s.note} />)}
    </div>
  );
}
