import { AppError, type FieldErrors } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';

// Request bodies of the group operations: trimmed, empty optional fields dropped, checked against schemas/api/.

/** A JSON object, or 422 with `hint` when the body is something else. */
export function asObject(body: unknown, hint: string): Record<string, unknown> {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) throw new AppError('validation_failed', hint);
  return body as Record<string, unknown>;
}

/** Strings trimmed; optional strings that are empty after trimming are left out (as a form sends them). */
export function tidy(input: Record<string, unknown>, optional: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(input)) {
    const value = typeof v === 'string' ? v.trim() : v;
    if (value === '' && optional.includes(k)) continue;
    out[k] = value;
  }
  return out;
}

/** Validates against the schema; 422 with field errors (our own words where given) when it does not fit. */
export function parseWith<T>(schema: object, data: unknown, words: FieldErrors = {}): T {
  const result = validateWith<T>(schema, data);
  if (result.ok) return result.value;
  const fieldErrors: FieldErrors = {};
  for (const [field, message] of Object.entries(result.fieldErrors)) fieldErrors[field] = words[field] ?? message;
  throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors });
}

export function fieldError(field: string, message: string, code: 'validation_failed' | 'conflict' = 'validation_failed'): AppError {
  return new AppError(code, message, { fieldErrors: { [field]: message } });
}
