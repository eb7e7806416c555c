// JoinChunks: storage's socket-sized chunks joined to larger ones before archiver, bytes and order unchanged.
import { randomBytes } from 'node:crypto';
import { once } from 'node:events';
import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { JoinChunks } from '@/lib/packages/join-chunks';

/** The chunks JoinChunks pushes, as 'data' events see them (an async iterator would merge what is buffered). */
async function through(chunks: Buffer[], joinBytes: number): Promise<Buffer[]> {
  const out: Buffer[] = [];
  const joined = Readable.from(chunks, { objectMode: false }).pipe(new JoinChunks(joinBytes));
  joined.on('data', (c: Buffer) => out.push(c));
  await once(joined, 'end');
  return out;
}

describe('JoinChunks', () => {
  it('joins 64 KiB chunks to 256 KiB ones and passes the remainder last, the bytes unchanged', async () => {
    const chunks = Array.from({ length: 10 }, () => randomBytes(64 * 1024));
    const out = await through(chunks, 256 * 1024);
    // 10 × 64 KiB = 2 full joins of 4 chunks and a last chunk of 2.
    expect(out.map((c) => c.length)).toEqual([256 * 1024, 256 * 1024, 128 * 1024]);
    expect(Buffer.concat(out).equals(Buffer.concat(chunks))).toBe(true);
  });

  it('hands a chunk at least that large on as the same buffer, uncopied, when nothing waits before it', async () => {
    const big = randomBytes(300_000);
    const small = randomBytes(1_000);
    const out = await through([big, small, big], 200_000);
    expect(out[0]).toBe(big);
    // The small chunk waits for the next one: joined with it into one chunk of 301 000 bytes.
    expect(out.map((c) => c.length)).toEqual([300_000, 301_000]);
    expect(Buffer.concat(out).equals(Buffer.concat([big, small, big]))).toBe(true);
  });

  it('gives nothing for an empty body and one short chunk for a body shorter than the join size', async () => {
    expect(await through([], 1024)).toEqual([]);
    const tiny = [Buffer.from('T (K),R (Ohm)\n'), Buffer.from('1.80,98.50\n')];
    const out = await through(tiny, 1024);
    expect(out.map((c) => c.toString())).toEqual(['T (K),R (Ohm)\n1.80,98.50\n']);
  });
});
