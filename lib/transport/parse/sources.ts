import type { ByteSource } from './types';

const DEFAULT_CHUNK = 64 * 1024;

/** A whole file already in memory (or a string, encoded as UTF-8) as a chunked byte source. */
export function bytesFromBuffer(data: Uint8Array | string, chunkSize = DEFAULT_CHUNK): ByteSource {
  const bytes = typeof data === 'string' ? new TextEncoder().encode(data) : data;
  return {
    async *[Symbol.asyncIterator]() {
      for (let i = 0; i < bytes.length; i += chunkSize) yield bytes.subarray(i, Math.min(i + chunkSize, bytes.length));
    },
  };
}

/** A web ReadableStream (browser File.stream(), fetch body) as a byte source; works where streams are not async-iterable. */
export function bytesFromWebStream(stream: ReadableStream<Uint8Array>): ByteSource {
  return {
    async *[Symbol.asyncIterator]() {
      const reader = stream.getReader();
      try {
        for (;;) {
          const { done, value } = await reader.read();
          if (done) return;
          if (value) yield value;
        }
      } finally {
        reader.releaseLock();
      }
    },
  };
}

// Node Readable streams are already AsyncIterable<Buffer> (Buffer is a Uint8Array): pass them as they are.

/**
 * The source's chunks, asking for the next one before handing out the current, so that reading (a file, a socket)
 * overlaps parsing instead of waiting for it. A source must not reuse a chunk's memory for the next one.
 */
export async function* readAhead(source: ByteSource): AsyncGenerator<Uint8Array, void, undefined> {
  const it = source[Symbol.asyncIterator]();
  let finished = false;
  let pending = it.next();
  try {
    for (;;) {
      const r = await pending;
      if (r.done) {
        finished = true;
        return;
      }
      pending = it.next();
      pending.catch(() => undefined); // a failure surfaces at the next await, not as an unhandled rejection meanwhile
      yield r.value;
    }
  } finally {
    // Stopped early (row limit, error, cancel): close the source as for-await would.
    if (!finished) await Promise.resolve(it.return?.()).catch(() => undefined);
  }
}
