import { createHash } from 'node:crypto';
import { File } from 'node:buffer';
import { describe, expect, it } from 'vitest';
import { hashBlobSha256, startHash } from '@/lib/client/uploads/hash-file';
import { patternBytes } from './fake-upload-server';

const text = (s: string) => new File([s], 'x.txt') as unknown as Blob;

describe('SHA-256 of a file, read in chunks', () => {
  it('matches the FIPS 180-4 examples (and FIPS 180-2 appendix B)', async () => {
    // FIPS 180-4 / NIST CSRC "SHA256.pdf" example values; B.3 is one million 'a'.
    expect(await hashBlobSha256(text('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(await hashBlobSha256(text('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'), { chunkBytes: 5 }))
      .toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
    expect(await hashBlobSha256(text('a'.repeat(1_000_000)), { chunkBytes: 65_536 }))
      .toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
    expect(await hashBlobSha256(text(''))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('gives the same digest as node:crypto for any chunk size, reporting progress per chunk', async () => {
    const bytes = patternBytes(300_001);
    const expected = createHash('sha256').update(bytes).digest('hex');
    for (const chunkBytes of [1 << 10, 65_536, 100_000, 1 << 20]) {
      const seen: number[] = [];
      expect(await hashBlobSha256(new File([bytes], 'p.bin') as unknown as Blob, { chunkBytes, onProgress: (n) => seen.push(n) })).toBe(expected);
      expect(seen.at(-1)).toBe(300_001);
      expect(seen.length).toBe(Math.ceil(300_001 / chunkBytes));
    }
  });

  it('continues after a pause from where it stopped, without reading the start again', async () => {
    const bytes = patternBytes(200_000, 3);
    const blob = new File([bytes], 'p.bin') as unknown as Blob;
    const progress = await startHash();
    const pause = new AbortController();
    await expect(hashBlobSha256(blob, {
      progress, chunkBytes: 50_000, signal: pause.signal,
      onProgress: (n) => { if (n === 100_000) pause.abort('paused'); },
    })).rejects.toBe('paused');
    expect(progress.offsetBytes).toBe(100_000);
    const resumedFrom: number[] = [];
    const digest = await hashBlobSha256(blob, { progress, chunkBytes: 50_000, onProgress: (n) => resumedFrom.push(n) });
    expect(resumedFrom).toEqual([150_000, 200_000]);
    expect(digest).toBe(createHash('sha256').update(bytes).digest('hex'));
  });
});
