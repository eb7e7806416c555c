// Storage bodies arrive in socket-sized chunks (up to 64 KiB). Joined to larger ones before archiver, each chunk costs
// one trip through archiver's streams (CRC-32, zip output, archive) and one write to the client instead of eight.
import { Transform, type TransformCallback } from 'node:stream';

/** Passes bytes on in chunks of at least `joinBytes` (the last may be shorter); a chunk that large goes on as it is. */
export class JoinChunks extends Transform {
  #parts: Buffer[] = [];
  #size = 0;

  constructor(readonly joinBytes: number) {
    // One joined chunk may wait on the readable side; the writable side takes at most one more before it pushes back.
    super({ readableHighWaterMark: joinBytes, writableHighWaterMark: joinBytes });
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    if (this.#size === 0 && chunk.length >= this.joinBytes) return callback(null, chunk);
    this.#parts.push(chunk);
    this.#size += chunk.length;
    if (this.#size < this.joinBytes) return callback();
    callback(null, this.#join());
  }

  override _flush(callback: TransformCallback): void {
    callback(null, this.#size > 0 ? this.#join() : undefined);
  }

  #join(): Buffer {
    const out = this.#parts.length === 1 ? this.#parts[0]! : Buffer.concat(this.#parts, this.#size);
    this.#parts = [];
    this.#size = 0;
    return out;
  }
}
