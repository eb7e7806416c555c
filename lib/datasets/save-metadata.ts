import 'server-only';
import { requeueAnalysis } from '@/lib/analysis/requeue-analysis';
import { AppError } from '@/lib/errors';
import { formatBytes } from '@/lib/format/bytes';
import { validateTransportDataset, type FieldError } from '@/lib/schema';
import type { DepositUser } from './create-dataset';
import { updateDraftMetadata } from './repo';
import { requireVersionAction } from './version-access';

/** Largest metadata record accepted (the record is small; big tables belong in files). */
export const MAX_METADATA_BYTES = 1024 * 1024;
const TITLE_COLUMN_CHARS = 500;
/** Parts of the record the file analysis reads; changing them makes the summaries stale. */
const ANALYSIS_INPUTS = ['columns', 'sample', 'measurement'] as const;

export type SaveMetadataResult = {
  saved: true;
  /** True when the record passes the full schema (ready to submit). */
  complete: boolean;
  /** Everything the full schema still objects to, missing fields included. */
  errors: FieldError[];
  /** Values present but wrong (the draft-mode errors): the author must fix these. */
  invalid: FieldError[];
};

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** JSON with sorted keys, so a record that only changed key order compares equal. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (isPlainObject(value)) return `{${Object.keys(value).sort().map((k) => `${JSON.stringify(k)}:${canonical(value[k])}`).join(',')}}`;
  return JSON.stringify(value) ?? 'null';
}

function analysisInputsChanged(before: unknown, after: Record<string, unknown>): boolean {
  const old = isPlainObject(before) ? before : {};
  return ANALYSIS_INPUTS.some((key) => canonical(old[key]) !== canonical(after[key]));
}

/**
 * Stores a draft's metadata record exactly as given, even when it fails the schema (a draft is never silently
 * dropped), and reports what the schema says about it.
 */
export async function saveMetadata(input: { user: DepositUser | null; versionId: string; record: unknown }): Promise<SaveMetadataResult> {
  const { version } = await requireVersionAction(input.versionId, input.user, 'edit');
  const { record } = input;
  if (!isPlainObject(record)) {
    const got = record === null ? 'null' : Array.isArray(record) ? 'a list' : `a ${typeof record}`;
    throw new AppError('validation_failed', `The metadata must be a JSON object (the dataset record); this was ${got}. Nothing was saved.`);
  }
  const json = JSON.stringify(record);
  const bytes = Buffer.byteLength(json, 'utf8');
  if (bytes > MAX_METADATA_BYTES) {
    throw new AppError('payload_too_large', `The metadata record is ${bytes} bytes, over the limit of ${MAX_METADATA_BYTES} bytes (${formatBytes(MAX_METADATA_BYTES)}). Put large tables in files. Nothing was saved.`);
  }

  const full = validateTransportDataset(record);
  const partial = validateTransportDataset(record, { partial: true });
  const title = typeof record.title === 'string' && record.title.trim() ? [...record.title.trim()].slice(0, TITLE_COLUMN_CHARS).join('') : null;
  if ((await updateDraftMetadata(version.id, json, title)) === 0) {
    throw new AppError('conflict', 'This version stopped being a draft while you were editing (it was submitted or deleted). Reload the page.');
  }
  if (analysisInputsChanged(version.metadata, record)) await requeueAnalysis(version.id);
  return { saved: true, complete: full.ok, errors: full.ok ? [] : full.errors, invalid: partial.ok ? [] : partial.errors };
}

/** The 422 the API answers when a saved draft has wrong values; null when only missing fields remain. */
export function needsFixingError(result: SaveMetadataResult): AppError | null {
  const n = result.invalid.length;
  if (n === 0) return null;
  const fieldErrors = Object.fromEntries(result.invalid.map((e) => [e.path || '(record)', e.message]));
  return new AppError('validation_failed', `Saved as draft, but ${n} ${n === 1 ? 'field needs' : 'fields need'} fixing.`, {
    saved: true, fieldErrors, errors: result.errors,
  });
}
