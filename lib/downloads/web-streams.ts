// Pull-based web streams for download bodies (stack.md "archiver 8": never Readable.toWeb, which crashes on abort).
import type { Readable } from 'node:stream';

const asError = (e: unknown): Error => (e instanceof Error ? e : new Error(String(e)));

/** Storage sent fewer bytes than the download announced: the client must see a broken transfer, not a short file. */
export class ShortBodyError extends Error {
  constructor(readonly expectedBytes: number, readonly gotBytes: number) {
    super(`storage ended the body after ${gotBytes} of ${expectedBytes} bytes`);
    this.name = 'ShortBodyError';
  }
}

/**
 * Exactly `lengthBytes` bytes of a storage body as a web stream, read only as fast as the client pulls. More bytes
 * than that are cut off (some stores ignore parts of a Range); fewer error the stream. cancel() destroys the body,
 * which closes its socket, so nothing more is read from storage.
 */
export function exactBodyStream(body: Readable, lengthBytes: number, onError?: (error: Error) => void): ReadableStream<Uint8Array> {
  const chunks = body[Symbol.asyncIterator]() as AsyncIterator<Buffer>;
  let remaining = lengthBytes;
  let stopped = false;
  const fail = (controller: ReadableStreamDefaultController<Uint8Array>, error: Error) => {
    stopped = true;
    body.destroy();
    onError?.(error);
    controller.error(error);
  };
  return new ReadableStream<Uint8Array>({
    start(controller) {
      if (lengthBytes === 0) {
        stopped = true;
        body.destroy();
        controller.close();
      }
    },
    async pull(controller) {
      let next: IteratorResult<Buffer>;
      try {
        next = await chunks.next();
      } catch (error) {
        if (!stopped) fail(controller, asError(error));
        return;
      }
      if (stopped) return;
      if (next.done) return fail(controller, new ShortBodyError(lengthBytes, lengthBytes - remaining));
      const chunk = next.value.length > remaining ? next.value.subarray(0, remaining) : next.value;
      remaining -= chunk.length;
      controller.enqueue(chunk);
      if (remaining > 0) return;
      stopped = true;
      controller.close();
      // Read on to the body's end so its socket can be reused; anything past our length is dropped with the socket.
      chunks.next().then((after) => void (after.done || body.destroy()), () => undefined);
    },
    cancel() {
      stopped = true;
      body.destroy();
    },
  });
}

export type RelayOptions = {
  /**
   * Source chunks smaller than this are joined with the ones after them until at least this many bytes (the first
   * chunk goes at once); a chunk at least this large passes as it is, uncopied, after any small ones held before it.
   */
  joinBytes?: number;
  /** The source failed: the client's stream errors with the same error, so it sees a broken transfer. */
  onError?: (error: Error) => void;
};

/**
 * Passes a web stream on, pulling from the source only when the client pulls. Nothing is awaited per chunk but the
 * source's read: the client's pace alone decides the reading.
 */
export function relayStream(source: ReadableStream<Uint8Array>, options: RelayOptions = {}): ReadableStream<Uint8Array> {
  const reader = source.getReader();
  const joinBytes = options.joinBytes ?? 0;
  let cancelled = false;
  let first = true;
  const send = (controller: ReadableStreamDefaultController<Uint8Array>, parts: Uint8Array[], size: number) => {
    first = false;
    controller.enqueue(parts.length === 1 ? parts[0]! : Buffer.concat(parts, size));
  };
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      const parts: Uint8Array[] = [];
      let size = 0;
      while (size < joinBytes || parts.length === 0) {
        let next: ReadableStreamReadResult<Uint8Array>;
        try {
          next = await reader.read();
        } catch (error) {
          if (cancelled) return;
          const failure = asError(error);
          options.onError?.(failure);
          controller.error(failure);
          return;
        }
        if (cancelled) return;
        if (next.done) {
          if (size > 0) send(controller, parts, size);
          controller.close();
          return;
        }
        if (size > 0 && next.value.length >= joinBytes) {
          send(controller, parts, size); // the small ones held so far, then the large chunk uncopied
          controller.enqueue(next.value);
          return;
        }
        parts.push(next.value);
        size += next.value.length;
        if (first) break;
      }
      send(controller, parts, size);
    },
    async cancel(reason) {
      cancelled = true;
      await reader.cancel(reason);
    },
  });
}
