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
