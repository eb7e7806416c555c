'use client';

import { useMemo } from 'react';
import { GroupField } from './group-field';
import { RecordFormContext, type RecordFormContextValue } from './record-context';
import { removeAt, setAt, type RecordPath } from './record-paths';
import { nodeAt } from './schema-walk';

export type RecordFormProps = {
  record: unknown;
  onChange: (record: unknown) => void;
  errors: Record<string, string>;
  readOnly: boolean;
};

// Our own grouping of the record's top-level parts; every field inside comes from the schema.
const PARTS: { key: string; heading: string; lead: string; path: RecordPath; omit?: string[] }[] = [
  { key: 'sample', heading: 'Sample', lead: 'What was measured, its geometry (for ρ, R□ and Hall quantities) and its contacts.', path: ['sample'] },
  { key: 'measurement', heading: 'Measurement', lead: 'Wiring, excitation and detection: what the quality checks and the derived values rely on.', path: ['measurement'] },
  { key: 'environment', heading: 'Environment', lead: 'Temperature and field ranges, orientation and the sweep.', path: ['environment'] },
  {
    key: 'about', heading: 'About the dataset', lead: 'Title, people, licence and related work, as they will be cited.', path: [],
    omit: ['sample', 'measurement', 'environment', 'columns'],
  },
];

/** The measurement record form, drawn from the schema, checked live with the server's validator. */
export function RecordForm({ record, onChange, errors, readOnly }: RecordFormProps) {
  const ctx = useMemo<RecordFormContextValue>(() => ({
    record,
    errors,
    readOnly,
    set: (path, value) => onChange(setAt(record, path, value)),
    remove: (path, index) => onChange(removeAt(record, path, index)),
  }), [record, errors, readOnly, onChange]);
  return (
    <RecordFormContext.Provider value={ctx}>
      <form className="flex flex-col gap-6" onSubmit={(e) => e.preventDefault()} aria-label="Measurement record" noValidate>
        {PARTS.map((part) => {
          const node = nodeAt(part.path);
          if (!node) return null;
          return (
            <section key={part.key} aria-labelledby={`part-${part.key}`} className="rounded-lg border border-slate-200 bg-white p-5">
              <h3 id={`part-${part.key}`} className="text-base font-semibold text-slate-900">{part.heading}</h3>
              <p className="mb-4 text-sm text-slate-600">{part.lead}</p>
              <GroupField path={part.path} node={node} omit={part.omit} legend="" />
            </section>
          );
        })}
      </form>
    </RecordFormContext.Provider>
  );
}
