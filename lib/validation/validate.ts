import Ajv2020, { type ErrorObject, type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';

// Shared Ajv for the small request schemas in schemas/ (forms and API bodies); browser-safe.
const ajv = new Ajv2020({ allErrors: true, strict: true, coerceTypes: false });
addFormats(ajv);
const compiled = new WeakMap<object, ValidateFunction>();

export type ValidationResult<T> = { ok: true; value: T } | { ok: false; fieldErrors: Record<string, string> };

function fieldOf(error: ErrorObject): string {
  const base = error.instancePath.split('/').filter(Boolean).join('.');
  if (error.keyword === 'required') return [base, String(error.params.missingProperty)].filter(Boolean).join('.');
  return base || '(record)';
}

function messageOf(error: ErrorObject, schemaTitle?: string): string {
  const what = schemaTitle ?? 'This field';
  switch (error.keyword) {
    case 'required': return 'This field is required.';
    case 'format': return `${what} is not a valid ${String(error.params.format)}.`;
    case 'minLength': return `${what} must be at least ${String(error.params.limit)} characters.`;
    case 'maxLength': return `${what} must be at most ${String(error.params.limit)} characters.`;
    case 'pattern': return `${what} has the wrong form.`;
    case 'enum': return `${what} must be one of: ${(error.params.allowedValues as unknown[]).join(', ')}.`;
    case 'type': return `${what} must be a ${String(error.params.type)}.`;
    case 'additionalProperties': return `Unknown field "${String(error.params.additionalProperty)}".`;
    default: return `${what} ${error.message ?? 'is not valid'}.`;
  }
}

export function validateWith<T>(schema: object, data: unknown): ValidationResult<T> {
  let validate = compiled.get(schema);
  if (!validate) {
    validate = ajv.compile(schema);
    compiled.set(schema, validate);
  }
  if (validate(data)) return { ok: true, value: data as T };
  const fieldErrors: Record<string, string> = {};
  for (const error of validate.errors ?? []) {
    const field = fieldOf(error);
    const title = (error.parentSchema as { title?: string } | undefined)?.title;
    fieldErrors[field] ??= messageOf(error, title);
  }
  return { ok: false, fieldErrors };
}
