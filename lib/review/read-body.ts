import 'server-only';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';

/** Reviewer-link bodies are a few short fields. */
const MAX_BODY_BYTES = 16 * 1024;

/** Reads a JSON body and checks it against its schema in schemas/api/ (422 with fieldErrors otherwise). */
export async function readLinkBody<T>(req: Request, schema: object): Promise<T> {
  const parsed = validateWith<T>(schema, await readJsonBody(req, MAX_BODY_BYTES));
  if (!parsed.ok) throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors: parsed.fieldErrors });
  return parsed.value;
}
