// Object storage stops between the part PUTs and the completion (issue 8 item 6): a private s3rver is stopped and
// restarted on the same port and data dir; the shared dev s3rver is never touched.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { listObjects, storeAt } from '@/lib/storage/objects';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { completeUpload } from '@/lib/uploads/complete-upload';
import { listFileViews } from '@/lib/uploads/list-files';
import { closeDb, createDraft, createTestLab, dropTestLabs, putParts, sha256Hex, type TestLab } from '../uploads/helpers';
import { privateS3rver, type PrivateService } from './private-services';

let lab: TestLab;
let s3: PrivateService & { endpoint: string };

beforeAll(async () => {
  s3 = await privateS3rver();
  await s3.start();
  lab = await createTestLab();
}, 60_000);

afterAll(async () => {
  try {
    await dropTestLabs();
    await closeDb();
  } finally {
    await s3?.dispose();
  }
}, 60_000);

describe('object storage down mid-upload', () => {
  it('completion answers 503 while storage is down, the file stays pending, and verifies once storage is back', async () => {
    const store = storeAt(s3.endpoint);
    const versionId = await createDraft(lab);
    const content = randomBytes(9000);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'outage-mid-upload.csv', sizeBytes: 9000, sha256: sha256Hex(content) } }, { store });
    await putParts(begin, begin.parts, content);
    expect((await listObjects(store, `staging/${begin.fileId}/`)).map((o) => o.key)).toEqual([`staging/${begin.fileId}/00001`]);

    await s3.stop();
    const error = await completeUpload({ user: lab.member, fileId: begin.fileId }, { store }).then(() => undefined, (e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect(error).toMatchObject({ code: 'service_unavailable', status: 503, message: 'File storage cannot be reached right now. Nothing was lost: try again in a minute.' });
    expect((await listFileViews(versionId))[0]).toMatchObject({ id: begin.fileId, uploadState: 'pending' });

    await s3.start();
    // The parts written before the outage are still there: s3rver keeps them in its data dir.
    expect(await listObjects(store, `staging/${begin.fileId}/`)).toHaveLength(1);
    const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId }, { store });
    expect(file).toMatchObject({ id: begin.fileId, uploadState: 'verified', sha256: sha256Hex(content), sizeBytes: 9000 });
    expect(await listObjects(store, `staging/${begin.fileId}/`)).toEqual([]);
  }, 60_000);
});
