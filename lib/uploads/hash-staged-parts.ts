import 'server-only';
import { createHash } from 'node:crypto';
import type { PartSource, StagedPart } from '@/lib/storage/multipart';
import { readObject, type ObjectStore } from '@/lib/storage/objects';
import { TEXT_SNIFF_BYTES } from './text-like';

export type StagedDigest = {
  sha256: string;
  sizeBytes: number;
  /** The first bytes of the file, to tell text from binary. */
  head: Uint8Array;
  /** Each part as it was read (ETag from the GET), for a join guarded against later overwrites. */
  sources: PartSource[];
};

/** Streams the parts in order through SHA-256, counting bytes; memory stays at one chunk whatever the file size. */
export async function hashStagedParts(store: ObjectStore, parts: StagedPart[]): Promise<StagedDigest> {
  const hash = createHash('sha256');
  const head = new Uint8Array(TEXT_SNIFF_BYTES);
  let headLength = 0;
  let sizeBytes = 0;
  const sources: PartSource[] = [];
  for (const part of parts) {
    const read = await readObject(store, part.key);
    let partBytes = 0;
    for await (const chunk of read.body) {
      hash.update(chunk);
      if (headLength < head.length) {
        const take = chunk.subarray(0, head.length - headLength);
        head.set(take, headLength);
        headLength += take.length;
      }
      partBytes += chunk.length;
    }
    sizeBytes += partBytes;
    sources.push({ key: part.key, sizeBytes: partBytes, etag: read.etag });
  }
  return { sha256: hash.digest('hex'), sizeBytes, head: head.subarray(0, headLength), sources };
}
