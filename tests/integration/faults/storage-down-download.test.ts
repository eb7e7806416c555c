// Object storage stops while a package is being streamed (issue 8 item 6): a private s3rver holds the payload and is
// stopped mid-read; the download must end in an error, never in a shorter zip that looks complete.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildPackageStream } from '@/lib/packages/build-package-stream';
import { storeAt, STORAGE_DOWN_MESSAGE } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { fileWithBytes, packageInput } from '../../unit/packages/fixtures';
import { privateS3rver, type PrivateService } from './private-services';

const MiB = 1024 * 1024;
let s3: PrivateService & { endpoint: string };

beforeAll(async () => {
  s3 = await privateS3rver();
  await s3.start();
}, 60_000);

afterAll(async () => {
  await s3?.dispose();
}, 60_000);

describe('object storage down mid-download', () => {
  it('the package stream errors after the outage instead of ending as a short zip', async () => {
    const store = storeAt(s3.endpoint);
    const files = [fileWithBytes('sweep-a.bin', randomBytes(16 * MiB), 'fault/sweep-a'), fileWithBytes('sweep-b.bin', randomBytes(16 * MiB), 'fault/sweep-b')];
    for (const f of files) await putObject(store, f.storageKey, f.bytes);

    const reader = buildPackageStream(packageInput(files), { store }).stream.getReader();
    let received = 0;
    while (received < 2 * MiB) {
      const { value, done } = await reader.read();
      if (done) throw new Error('the package ended before storage could be stopped');
      received += value.length;
    }
    await s3.stop();

    let outcome: 'ended' | Error = 'ended';
    try {
      for (let r = await reader.read(); !r.done; r = await reader.read()) received += r.value.length;
    } catch (error) {
      outcome = error as Error;
    }
    expect(outcome).toBeInstanceOf(Error);
    expect((outcome as Error).message).toMatch(new RegExp(`${STORAGE_DOWN_MESSAGE.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}|fault/sweep-a`));
    // Less than the payload reached the client: the stream stopped inside the first object, not after a tidy end.
    expect(received).toBeLessThan(32 * MiB);
  }, 60_000);
});
