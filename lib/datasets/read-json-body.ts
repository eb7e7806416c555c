import 'server-only';
import { AppError } from '@/lib/errors';
import { formatBytes } from '@/lib/format/bytes';

/** Reads a JSON request body, refusing (413) past `maxBytes` without buffering the rest. */
export async function readJsonBody(req: Request, maxBytes: number): Promise<unknown> {
  const declared = Number(req.headers.get('content-length') ?? NaN);
  const tooLarge = (size: string) => new AppError('payload_too_large', `The request body is ${size}; the limit is ${formatBytes(maxBytes)}. Nothing was saved.`);
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(formatBytes(declared));
  const chunks: Uint8Array[] = [];
  let size = 0;
  if (req.body) {
    const reader = req.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > maxBytes) {
        await reader.cancel();
        throw tooLarge(`over ${formatBytes(maxBytes)}`);
      }
      chunks.push(value);
    }
  }
  try {
    return JSON.parse(Buffer.concat(chunks).toString('utf8'));
  } catch {
    throw new AppError('validation_failed', 'The request body is not valid JSON. Nothing was saved.');
  }
}
