import { createSHA256, type IHasher } from 'hash-wasm';

/** 4 MiB reads: large enough to keep the WebAssembly hasher busy, small enough to stay light on memory. */
export const HASH_CHUNK_BYTES = 4 * 1024 * 1024;

/** Where a paused hash stopped; keep it to continue without reading the file from the start again. */
export type HashProgress = { hasher: IHasher; offsetBytes: number };

export async function startHash(): Promise<HashProgress> {
  const hasher = await createSHA256();
  hasher.init();
  return { hasher, offsetBytes: 0 };
}

/**
 * SHA-256 (FIPS 180-4) of a Blob, streamed in File.slice chunks so a multi-gigabyte file never sits in memory.
 * Aborting leaves `progress` at the last whole chunk; calling again with it continues from there.
 */
export async function hashBlobSha256(
  blob: Blob,
  opts: { progress?: HashProgress; signal?: AbortSignal; chunkBytes?: number; onProgress?: (hashedBytes: number) => void } = {},
): Promise<string> {
  const progress = opts.progress ?? (await startHash());
  const chunk = opts.chunkBytes ?? HASH_CHUNK_BYTES;
  while (progress.offsetBytes < blob.size) {
    if (opts.signal?.aborted) throw opts.signal.reason;
    const end = Math.min(progress.offsetBytes + chunk, blob.size);
    const bytes = new Uint8Array(await blob.slice(progress.offsetBytes, end).arrayBuffer());
    if (opts.signal?.aborted) throw opts.signal.reason; // the read finished after a pause: drop it, keep the state whole
    progress.hasher.update(bytes);
    progress.offsetBytes = end;
    opts.onProgress?.(end);
  }
  return progress.hasher.digest('hex');
}
