'use client';

import { createContext, useContext } from 'react';
import type { RecordPath } from './record-paths';

export type RecordFormContextValue = {
  record: unknown;
  /** Sets (or with undefined removes) the value at `path`. */
  set: (path: RecordPath, value: unknown) => void;
  /** Removes entry `index` of the list at `path`. */
  remove: (path: RecordPath, index: number) => void;
  /** Messages under fields, by dotted path. */
  errors: Record<string, string>;
  readOnly: boolean;
};

export const RecordFormContext = createContext<RecordFormContextValue | null>(null);

export function useRecordForm(): RecordFormContextValue {
  const ctx = useContext(RecordFormContext);
  if (!ctx) throw new Error('useRecordForm() outside <RecordFormContext.Provider>');
  return ctx;
}
