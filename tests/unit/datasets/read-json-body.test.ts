// readJsonBody with real Fetch API Requests (Node's undici): size limit of issue 4's metadata route (≤ 1 MB).
import { describe, expect, it } from 'vitest';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { AppError } from '@/lib/errors';

const url = 'http://127.0.0.1/api/v1/versions/x/metadata';

function streamed(text: string, chunkBytes = 1000): Request {
  const bytes = new TextEncoder().encode(text);
  let offset = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (offset >= bytes.length) return controller.close();
      controller.enqueue(bytes.subarray(offset, offset + chunkBytes));
      offset += chunkBytes;
    },
  });
  return new Request(url, { method: 'PUT', body, duplex: 'half' } as RequestInit & { duplex: 'half' });
}

async function failure(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

describe('readJsonBody', () => {
  it('parses a body up to the limit, UTF-8 included', async () => {
    const body = JSON.stringify({ title: 'ρ(T) at 4.2 K' });
    expect(Buffer.byteLength(body)).toBe(26); // 10 + 14 (ρ is 2 bytes in UTF-8) + 2
    expect(await readJsonBody(streamed(body, 5), 26)).toEqual({ title: 'ρ(T) at 4.2 K' });
  });

  it('refuses (413) a streamed body one byte over the limit without a length header', async () => {
    const error = await failure(readJsonBody(streamed(JSON.stringify({ d: 'x'.repeat(92) })), 99));
    expect(error.status).toBe(413);
    expect(error.message).toBe('The request body is over 99 B; the limit is 99 B. Nothing was saved.');
  });

  it('refuses (413) at once when Content-Length already says too much', async () => {
    const req = new Request(url, { method: 'PUT', body: 'x'.repeat(2048), headers: { 'content-length': '2048' } });
    const error = await failure(readJsonBody(req, 1024));
    expect(error.message).toBe('The request body is 2.00 KiB; the limit is 1.00 KiB. Nothing was saved.');
  });

  it('refuses (422) text that is not JSON, and an empty body', async () => {
    expect((await failure(readJsonBody(streamed('{"title": '), 1024))).status).toBe(422);
    expect((await failure(readJsonBody(new Request(url, { method: 'PUT' }), 1024))).message).toBe('The request body is not valid JSON. Nothing was saved.');
  });
});
