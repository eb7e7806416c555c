import 'server-only';
import { AppError, type FieldErrors } from '@/lib/errors';
import { log } from '@/lib/log';

export type ActionState<T = unknown> =
  | { ok: true; data?: T; message?: string }
  | { ok: false; error: string; fieldErrors?: FieldErrors; values?: Record<string, string> }
  | null;

/** Runs a server action body and turns failures into a state the form can show (never a stack trace). */
export async function runAction<T>(body: () => Promise<T>, values?: Record<string, string>): Promise<ActionState<T>> {
  try {
    return { ok: true, data: await body() };
  } catch (error) {
    if (error instanceof AppError) {
      return { ok: false, error: error.message, fieldErrors: error.details?.fieldErrors, values };
    }
    log('error', 'server action failed', { error: error instanceof Error ? error.stack : String(error) });
    return { ok: false, error: 'Something went wrong on our side. Your input is kept; try again.', values };
  }
}

/** FormData as plain strings (files excluded), for schemas and for re-filling a form. */
export function formValues(form: FormData, keys: string[]): Record<string, string> {
  return Object.fromEntries(keys.map((k) => [k, typeof form.get(k) === 'string' ? (form.get(k) as string) : '']));
}
