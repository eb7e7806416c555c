import { validateTransportDataset, type FieldError } from '@/lib/schema';
import { getAt } from './record-paths';

export type RecordCheck = {
  /** Messages shown under fields, by dotted path. */
  inline: Record<string, string>;
  /** Values that are wrong now (kind, range, form): the draft saves, but these need fixing. */
  wrong: FieldError[];
  /** What is still missing before the record is complete (shown as a checklist). */
  missing: FieldError[];
  complete: boolean;
};

function parentOf(path: string): string[] {
  return path.split('.').slice(0, -1);
}

/**
 * Live check of the draft with the server's validator (lib/schema): draft mode finds wrong values, full mode what is
 * missing. A missing field is shown at its place only once its parent exists (a creator added without a name), so an
 * untouched form is not a wall of red.
 */
export function checkRecord(record: unknown): RecordCheck {
  const full = validateTransportDataset(record);
  const partial = validateTransportDataset(record, { partial: true });
  const wrong = partial.ok ? [] : partial.errors;
  const wrongKeys = new Set(wrong.map((e) => `${e.path}\u0000${e.keyword}`));
  const missing = full.ok ? [] : full.errors.filter((e) => !wrongKeys.has(`${e.path}\u0000${e.keyword}`));
  const inline: Record<string, string> = {};
  for (const e of wrong) inline[e.path] ??= e.message;
  for (const e of missing) {
    const parent = parentOf(e.path);
    if (parent.length > 0 && getAt(record, parent.map((s) => (/^\d+$/.test(s) ? Number(s) : s))) !== undefined) inline[e.path] ??= e.message;
  }
  return { inline, wrong, missing, complete: full.ok };
}
