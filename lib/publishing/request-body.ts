import 'server-only';
import { AppError } from '@/lib/errors';
import { validateWith } from '@/lib/validation/validate';

/** Transition bodies are a few fields; anything larger is refused unread. */
const MAX_BODY_BYTES = 64 * 1024;

/** Reads a small JSON body (an empty body counts as {}) and checks it against a schema in schemas/api/. */
export async function readTransitionBody<T>(req: Request, schema: object): Promise<T> {
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > MAX_BODY_BYTES) throw new AppError('payload_too_large', 'The request body is larger than 64 KiB.');
  const text = await req.text();
  if (Buffer.byteLength(text) > MAX_BODY_BYTES) throw new AppError('payload_too_large', 'The request body is larger than 64 KiB.');
  let body: unknown = {};
  if (text.trim()) {
    try {
      body = JSON.parse(text);
    } catch {
      throw new AppError('validation_failed', 'The request body is not valid JSON.');
    }
  }
  const parsed = validateWith<T>(schema, body);
  if (!parsed.ok) throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors: parsed.fieldErrors });
  return parsed.value;
}
