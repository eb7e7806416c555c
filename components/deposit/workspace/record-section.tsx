'use client';

import { useMemo } from 'react';
import { Completeness } from '@/components/deposit/record/completeness';
import { applySuggestions, suggestionsFrom } from '@/components/deposit/record/prefill';
import type { RecordCheck } from '@/components/deposit/record/record-check';
import { RecordForm } from '@/components/deposit/record/record-form';
import { SuggestionsBox } from '@/components/deposit/record/suggestions-box';
import type { SummarySource } from './summary-sources';

export type RecordSectionProps = {
  record: unknown;
  onChange: (record: unknown) => void;
  errors: Record<string, string>;
  check: RecordCheck;
  sources: SummarySource[];
  readOnly: boolean;
};

/** Prefill offer, the record form, and what is still missing. */
export function RecordSection({ record, onChange, errors, check, sources, readOnly }: RecordSectionProps) {
  const suggestions = useMemo(() => suggestionsFrom(record, sources), [record, sources]);
  return (
    <div className="flex flex-col gap-6">
      <SuggestionsBox suggestions={suggestions} readOnly={readOnly} onApply={() => onChange(applySuggestions(record, suggestions))} />
      <RecordForm record={record} onChange={onChange} errors={errors} readOnly={readOnly} />
      <section aria-labelledby="completeness-heading">
        <h3 id="completeness-heading" className="mb-2 text-base font-semibold text-slate-900">Before you submit</h3>
        <Completeness wrong={check.wrong} missing={check.missing} />
      </section>
    </div>
  );
}
