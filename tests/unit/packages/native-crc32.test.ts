// zlib.crc32 in place of crc-32's JS buf must give zip-stream the very same CRC-32 values.
import { randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import * as crc32Module from 'crc-32';
import { routeCrc32ToZlib } from '@/lib/packages/native-crc32';
import { referenceCrc32 } from './fixtures';

const buf = () => ((crc32Module as unknown as { default?: typeof crc32Module }).default ?? crc32Module).buf;

describe('routeCrc32ToZlib', () => {
  it('is in effect on the same exports object zip-stream uses', () => {
    expect(routeCrc32ToZlib()).toBe(true);
    expect((buf() as { native?: boolean }).native).toBe(true);
  });

  it('gives the CRC catalogue check value for "123456789": 0xCBF43926', () => {
    expect(buf()(Buffer.from('123456789')) >>> 0).toBe(0xcbf43926);
  });

  it('matches the bitwise reference, signed like crc-32, chained over chunks and from a Buffer seed', () => {
    const data = randomBytes(100_003);
    const whole = referenceCrc32(data);
    expect(buf()(data)).toBe(whole | 0);
    // CRC32Stream starts from a 4-byte Buffer seed and feeds its chunks one by one.
    let running: number = buf()(data.subarray(0, 4096), Buffer.alloc(4) as unknown as number);
    for (let i = 4096; i < data.length; i += 65_536) running = buf()(data.subarray(i, i + 65_536), running) >>> 0;
    expect(running >>> 0).toBe(whole);
    expect(buf()([0x31, 0x32, 0x33]) >>> 0).toBe(referenceCrc32(Buffer.from('123')));
  });
});
