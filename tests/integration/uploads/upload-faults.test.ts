// Bad input and faults (issue 4): wrong checksum or size, cancel, limits, storage down, abandoned uploads.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { defaultStore, listObjects, storeAt } from '@/lib/storage/objects';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { cancelUpload } from '@/lib/uploads/cancel-upload';
import { cleanupStaleUploads } from '@/lib/uploads/cleanup-stale-uploads';
import { completeUpload } from '@/lib/uploads/complete-upload';
import { getUploadStatus } from '@/lib/uploads/get-upload-status';
import { listFileViews } from '@/lib/uploads/list-files';
import { closeDb, closedPortUrl, createDraft, createTestLab, dropTestLabs, groupUsedBytes, putParts, sha256Hex, stagedKeys, type TestLab } from './helpers';

const MiB = 1024 ** 2;
let lab: TestLab;

beforeAll(async () => {
  lab = await createTestLab();
});

afterAll(async () => {
  await dropTestLabs();
  await closeDb();
});

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

describe('verification refuses what does not match, keeping nothing', () => {
  it('checksum mismatch → 422 naming both digests, no file row, no staged object', async () => {
    const versionId = await createDraft(lab);
    const sent = randomBytes(6000);
    const declared = sha256Hex(randomBytes(6000));
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'flipped-bits.csv', sizeBytes: sent.length, sha256: declared } });
    await putParts(begin, begin.parts, sent);
    const usedBefore = await groupUsedBytes(lab.groupId);
    const error = await refusal(completeUpload({ user: lab.member, fileId: begin.fileId }));
    expect(error.code).toBe('validation_failed');
    expect(error.message).toBe(
      `The file arrived with SHA-256 ${sha256Hex(sent)}, but ${declared} was declared: it changed or was damaged on the way. Nothing was kept; upload it again.`,
    );
    expect(error.details).toEqual({ declaredSha256: declared, actualSha256: sha256Hex(sent) });
    expect(await db()('files').where({ id: begin.fileId }).first()).toBeUndefined();
    expect(await stagedKeys(begin.fileId)).toEqual([]);
    expect(await db()('blobs').where({ sha256: sha256Hex(sent) }).first()).toBeUndefined();
    expect(await groupUsedBytes(lab.groupId)).toBe(usedBefore);
  });

  it('checksum mismatch in a two-part upload is refused the same way', async () => {
    const versionId = await createDraft(lab);
    const sent = randomBytes(8 * MiB + 10);
    const declared = sha256Hex(Buffer.concat([sent.subarray(0, 8 * MiB), Buffer.alloc(10)]));
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'two-parts.bin', sizeBytes: sent.length, sha256: declared } });
    await putParts(begin, begin.parts, sent);
    const error = await refusal(completeUpload({ user: lab.member, fileId: begin.fileId }));
    expect(error.details).toEqual({ declaredSha256: declared, actualSha256: sha256Hex(sent) });
    expect(await listFileViews(versionId)).toEqual([]);
    expect(await stagedKeys(begin.fileId)).toEqual([]);
  });

  it('size mismatch → 422 with both sizes, nothing kept', async () => {
    const versionId = await createDraft(lab);
    const sent = randomBytes(1000);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'short.dat', sizeBytes: 1010, sha256: sha256Hex(sent) } });
    await putParts(begin, begin.parts, sent);
    const error = await refusal(completeUpload({ user: lab.member, fileId: begin.fileId }));
    expect(error.code).toBe('validation_failed');
    expect(error.message).toBe(
      'The upload holds 1000 B (1,000 bytes) but 1010 B (1,010 bytes) was declared (part 1 holds 1000 bytes where 1010 belong). Nothing was kept; upload the file again.',
    );
    expect(error.details).toEqual({ declaredSizeBytes: 1010, actualSizeBytes: 1000 });
    expect(await listFileViews(versionId)).toEqual([]);
    expect(await stagedKeys(begin.fileId)).toEqual([]);
  });

  it('a part of the wrong size counts as missing in the status, so the resume sends it again', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(500);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'retry.csv', sizeBytes: 500, sha256: sha256Hex(content) } });
    await putParts(begin, begin.parts, content.subarray(0, 200));
    const status = await getUploadStatus({ user: lab.member, fileId: begin.fileId });
    expect(status.completedParts).toEqual([]);
    expect(status.parts.map((p) => p.partNumber)).toEqual([1]);
    await putParts(status, status.parts, content);
    expect((await completeUpload({ user: lab.member, fileId: begin.fileId })).file.uploadState).toBe('verified');
  });
});

describe('cancel and cleanup', () => {
  it('cancel removes the row and the staged parts', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(8 * MiB + 1);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'cancel-me.bin', sizeBytes: content.length, sha256: sha256Hex(content) } });
    await putParts(begin, begin.parts.slice(0, 1), content);
    expect(await stagedKeys(begin.fileId)).toEqual([`staging/${begin.fileId}/00001`]);
    await cancelUpload({ user: lab.member, fileId: begin.fileId });
    expect(await db()('files').where({ id: begin.fileId }).first()).toBeUndefined();
    expect(await stagedKeys(begin.fileId)).toEqual([]);
    const again = await refusal(getUploadStatus({ user: lab.member, fileId: begin.fileId }));
    expect(again.code).toBe('not_found');
  });

  it('cleanupStaleUploads removes uploads untouched for 24 h, and parts no upload owns', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(300);
    const stale = await beginUpload({ user: lab.member, versionId, input: { name: 'abandoned.csv', sizeBytes: 300, sha256: sha256Hex(content) } });
    await putParts(stale, stale.parts, content);
    await db()('files').where({ id: stale.fileId }).update({ updated_at: new Date(Date.now() - 25 * 3600_000) });
    const fresh = await beginUpload({ user: lab.member, versionId, input: { name: 'in-progress.csv', sizeBytes: 300, sha256: sha256Hex(content) } });
    await putParts(fresh, fresh.parts, content);
    // A PUT that lands after its upload was cancelled: the object has no pending row.
    const late = await beginUpload({ user: lab.member, versionId, input: { name: 'late.csv', sizeBytes: 300, sha256: sha256Hex(content) } });
    await cancelUpload({ user: lab.member, fileId: late.fileId });
    await putParts(late, late.parts, content);
    expect(await stagedKeys(late.fileId)).toHaveLength(1);

    const result = await cleanupStaleUploads({ orphanGraceMs: 0, now: new Date(Date.now() + 2000) });
    expect(result.uploadsRemoved).toBeGreaterThanOrEqual(1);
    expect(result.orphanObjectsRemoved).toBeGreaterThanOrEqual(1);
    expect(await db()('files').where({ id: stale.fileId }).first()).toBeUndefined();
    expect(await stagedKeys(stale.fileId)).toEqual([]);
    expect(await stagedKeys(late.fileId)).toEqual([]);
    // The upload in progress keeps its row and its part.
    expect((await listFileViews(versionId)).map((f) => f.name)).toEqual(['in-progress.csv']);
    expect(await stagedKeys(fresh.fileId)).toEqual([`staging/${fresh.fileId}/00001`]);
  });
});

describe('limits', () => {
  it('413 for a file over the per-file limit (20 GiB by default), in words and numbers', async () => {
    const versionId = await createDraft(lab);
    const sizeBytes = 20 * 1024 ** 3 + 1;
    const error = await refusal(beginUpload({ user: lab.member, versionId, input: { name: 'huge.dat', sizeBytes, sha256: 'c'.repeat(64) } }));
    expect(error.code).toBe('payload_too_large');
    expect(error.status).toBe(413);
    expect(error.message).toBe(
      'This file is 20.0 GiB (21,474,836,481 bytes); one file may be at most 20.0 GiB (21,474,836,480 bytes). Split it, or ask the site admin about the limit.',
    );
    expect(await listFileViews(versionId)).toEqual([]);
  });

  it('413 when the group quota, counting uploads in progress, has no room', async () => {
    const small = await createTestLab(1 * MiB);
    const versionId = await createDraft(small);
    const first = await beginUpload({ user: small.member, versionId, input: { name: 'a.csv', sizeBytes: 600 * 1024, sha256: 'd'.repeat(64) } });
    expect(first.partCount).toBe(1);
    const error = await refusal(beginUpload({ user: small.member, versionId, input: { name: 'b.csv', sizeBytes: 600 * 1024, sha256: 'e'.repeat(64) } }));
    expect(error.code).toBe('payload_too_large');
    const name = (await db()('groups').where({ id: small.groupId }).first('name')).name;
    expect(error.message).toBe(
      `${name} has 1.00 MiB of storage; 0 B is used and 600.0 KiB is reserved by uploads in progress, so 424.0 KiB is free, but this file is 600.0 KiB. ` +
        'Remove files from drafts, or ask a group owner to raise the quota.',
    );
    expect((await listFileViews(versionId)).map((f) => f.name)).toEqual(['a.csv']);
  });
});

describe('object storage unreachable', () => {
  it('complete answers 503 and keeps the upload pending; a retry with storage back verifies it', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(2048);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'during-outage.csv', sizeBytes: content.length, sha256: sha256Hex(content) } });
    await putParts(begin, begin.parts, content);
    const down = storeAt(await closedPortUrl());
    const error = await refusal(completeUpload({ user: lab.member, fileId: begin.fileId }, { store: down }));
    expect(error.code).toBe('service_unavailable');
    expect(error.status).toBe(503);
    expect(error.message).toBe('File storage cannot be reached right now. Nothing was lost: try again in a minute.');
    expect((await listFileViews(versionId))[0]).toMatchObject({ id: begin.fileId, uploadState: 'pending' });
    expect(await stagedKeys(begin.fileId)).toHaveLength(1);
    const status = await refusal(getUploadStatus({ user: lab.member, fileId: begin.fileId }, { store: down }));
    expect(status.code).toBe('service_unavailable');
    const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId });
    expect(file).toMatchObject({ uploadState: 'verified', sha256: sha256Hex(content) });
  });

  it('a cancel during the outage removes the row; the cleanup deletes the parts once storage is back', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(700);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'cancel-in-outage.csv', sizeBytes: 700, sha256: sha256Hex(content) } });
    await putParts(begin, begin.parts, content);
    await cancelUpload({ user: lab.member, fileId: begin.fileId }, { store: storeAt(await closedPortUrl()) });
    expect(await db()('files').where({ id: begin.fileId }).first()).toBeUndefined();
    expect(await stagedKeys(begin.fileId)).toHaveLength(1);
    await cleanupStaleUploads({ orphanGraceMs: 0, now: new Date(Date.now() + 2000) });
    expect(await stagedKeys(begin.fileId)).toEqual([]);
    expect((await listObjects(defaultStore(), `staging/${begin.fileId}`)).length).toBe(0);
  });
});
