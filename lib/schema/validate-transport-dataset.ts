import type { ErrorObject, ValidateFunction } from 'ajv';
import schema from '@/schemas/transport-dataset.schema.json';
import { fieldLabel, type SchemaNode } from './field-labels';
import { plainMessage } from './messages';
import compiledValidator from './transport-dataset.validate.generated';
import type { TransportDataset } from './transport-dataset.types';

/** One problem with one field; `path` is dotted ('sample.geometry.thickness.value', 'creators.0.name'). */
export type FieldError = { path: string; message: string; keyword: string };
/** A draft: any field may still be missing, but what is present has the right shape. */
export type DeepPartial<T> = T extends (infer U)[] ? DeepPartial<U>[] : T extends object ? { [K in keyof T]?: DeepPartial<T[K]> } : T;
export type TransportDatasetDraft = DeepPartial<TransportDataset>;
export type ValidationOutcome<T> = { ok: true; value: T } | { ok: false; errors: FieldError[] };
export type TransportDatasetValidation = ValidationOutcome<TransportDataset>;
export type ValidateOptions = {
  /** Draft mode: missing fields (and present-but-empty text or lists) are fine; wrong types, enums and ranges are not. */
  partial?: boolean;
};

export const TRANSPORT_DATASET_SCHEMA_ID: string = schema.$id;

// Drafts are saved as the author types: absent fields, and present-but-still-empty text or lists, are not errors yet.
const isCompletenessError = (e: ErrorObject) =>
  e.keyword === 'required' || ((e.keyword === 'minLength' || e.keyword === 'minItems') && Number(e.params.limit) === 1);

// Compiled ahead of time by Ajv (strict, allErrors, verbose) from the same schema: see generate-transport-dataset-validator.ts.
const validator = (): ValidateFunction => compiledValidator as ValidateFunction;

const root = schema as unknown as SchemaNode;

function toFieldError(e: ErrorObject): FieldError {
  const base = e.instancePath.split('/').filter(Boolean).map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'));
  const parent = e.parentSchema as { title?: string; examples?: unknown[] } | undefined;
  const example = typeof parent?.examples?.[0] === 'string' ? parent.examples[0] : undefined;
  const last = base[base.length - 1];
  if (e.keyword === 'required') {
    const segments = [...base, String(e.params.missingProperty)];
    return { path: segments.join('.'), keyword: e.keyword, message: plainMessage(e, { label: fieldLabel(root, segments) }) };
  }
  if (e.keyword === 'additionalProperties') {
    const path = [...base, String(e.params.additionalProperty)].join('.');
    return { path, keyword: e.keyword, message: plainMessage(e, { label: fieldLabel(root, base) }) };
  }
  // The failing schema's own title is the most specific (a DOI branch of an if/then), except for generic value/unit parts.
  const label = parent?.title && last !== 'value' && last !== 'unit' && !/^\d+$/.test(last ?? '') ? parent.title : fieldLabel(root, base);
  return { path: base.join('.'), keyword: e.keyword, message: plainMessage(e, { label, example }) };
}

/** Validates a transport-dataset record against schemas/transport-dataset.schema.json (server and browser). */
export function validateTransportDataset(record: unknown, options: { partial: true }): ValidationOutcome<TransportDatasetDraft>;
export function validateTransportDataset(record: unknown, options?: { partial?: false }): TransportDatasetValidation;
export function validateTransportDataset(record: unknown, options: ValidateOptions): ValidationOutcome<TransportDatasetDraft>;
export function validateTransportDataset(record: unknown, options: ValidateOptions = {}): ValidationOutcome<TransportDatasetDraft> {
  const validate = validator();
  if (validate(record)) return { ok: true, value: record as TransportDataset };
  const mapped = (validate.errors ?? [])
    // 'if' only says "the then-branch failed"; that branch's own error is reported.
    .filter((e) => e.keyword !== 'if' && !(options.partial && isCompletenessError(e)))
    .map(toFieldError);
  const keys = new Set(mapped.map((fe) => `${fe.path}\u0000${fe.keyword}`));
  const seen = new Set<string>();
  const errors: FieldError[] = [];
  for (const fe of mapped) {
    const key = `${fe.path}\u0000${fe.keyword}`;
    // A value in the wrong form also fails its format check; one message per field is enough.
    if (seen.has(key) || (fe.keyword === 'format' && keys.has(`${fe.path}\u0000pattern`))) continue;
    seen.add(key);
    errors.push(fe);
  }
  return errors.length === 0 ? { ok: true, value: record as TransportDatasetDraft } : { ok: false, errors };
}
