// Uploads against the running MariaDB and s3rver: begin → PUT parts to presigned URLs → complete, resume, dedupe, remove.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { defaultStore, objectExists, readObject } from '@/lib/storage/objects';
import { beginUpload } from '@/lib/uploads/begin-upload';
import { blobKey, completeUpload } from '@/lib/uploads/complete-upload';
import { getUploadStatus } from '@/lib/uploads/get-upload-status';
import { listFileViews } from '@/lib/uploads/list-files';
import { removeFile } from '@/lib/uploads/remove-file';
import { updateFile } from '@/lib/uploads/update-file';
import { AppError } from '@/lib/errors';
import { closeDb, createDraft, createTestLab, dropTestLabs, groupUsedBytes, putParts, sha256Hex, stagedKeys, type TestLab } from './helpers';

const MiB = 1024 ** 2;
let lab: TestLab;

beforeAll(async () => {
  lab = await createTestLab();
});

afterAll(async () => {
  await dropTestLabs();
  await closeDb();
});

async function sha256OfObject(key: string): Promise<{ sha256: string; bytes: number }> {
  const read = await readObject(defaultStore(), key);
  const chunks: Uint8Array[] = [];
  for await (const c of read.body) chunks.push(c);
  const all = Buffer.concat(chunks);
  return { sha256: sha256Hex(all), bytes: all.length };
}

describe('a two-part upload', () => {
  // 9.5 MiB of random bytes: two parts of the 8 MiB plan, so the parts are joined (streamed on s3rver).
  const bytes = randomBytes(9.5 * MiB);
  const sha256 = sha256Hex(bytes);
  let versionId: string;
  let fileId: string;

  it('begins with one presigned URL per 8 MiB part', async () => {
    versionId = await createDraft(lab);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'lcl-cu-w07-raw.bin', sizeBytes: bytes.length, sha256, role: 'raw' } });
    fileId = begin.fileId;
    expect(begin.partSizeBytes).toBe(8 * MiB);
    expect(begin.partCount).toBe(2);
    expect(begin.parts.map((p) => p.partNumber)).toEqual([1, 2]);
    const url = new URL(begin.parts[0]!.url);
    expect(url.pathname).toBe(`/${process.env.S3_BUCKET}/staging/${fileId}/00001`);
    expect(url.searchParams.get('X-Amz-Algorithm')).toBe('AWS4-HMAC-SHA256');
    expect(url.searchParams.get('X-Amz-Expires')).toBe(String(12 * 3600));
    const [row] = await listFileViews(versionId);
    expect(row).toMatchObject({ id: fileId, uploadState: 'pending', sizeBytes: bytes.length, sha256, analysisState: 'none' });
  });

  it('after part 1 only, the status lists it as complete and gives a URL for part 2 alone; completing now is 409', async () => {
    const begin = await getUploadStatus({ user: lab.member, fileId });
    await putParts(begin, begin.parts.filter((p) => p.partNumber === 1), bytes);
    const status = await getUploadStatus({ user: lab.member, fileId });
    // The ETag of a part is the MD5 of its bytes (S3 convention for single-part objects).
    const md5 = (await import('node:crypto')).createHash('md5').update(bytes.subarray(0, 8 * MiB)).digest('hex');
    expect(status.completedParts).toEqual([{ partNumber: 1, etag: md5, sizeBytes: 8 * MiB }]);
    expect(status.parts.map((p) => p.partNumber)).toEqual([2]);
    const early = await completeUpload({ user: lab.member, fileId }).catch((e: unknown) => e);
    expect(early).toBeInstanceOf(AppError);
    expect((early as AppError).code).toBe('conflict');
    expect((early as AppError).details).toMatchObject({ missingParts: [2] });
    expect((await listFileViews(versionId))[0]?.uploadState).toBe('pending');
  });

  it('resumes with the status URL, completes, and stores the content under its SHA-256', async () => {
    const usedBefore = await groupUsedBytes(lab.groupId);
    const status = await getUploadStatus({ user: lab.member, fileId });
    const etags = await putParts(status, status.parts, bytes);
    const first = status.completedParts.map((p) => ({ partNumber: p.partNumber, etag: `"${p.etag}"` }));
    const { file } = await completeUpload({ user: lab.member, fileId, input: { parts: [...first, ...etags] } });
    expect(file).toMatchObject({ id: fileId, uploadState: 'verified', sha256, sizeBytes: bytes.length, name: 'lcl-cu-w07-raw.bin', role: 'raw' });
    // Random bytes are not text: no analysis.
    expect(file.analysisState).toBe('none');
    const blob = await db()('blobs').where({ sha256 }).first();
    expect(blob).toMatchObject({ storage_key: `blobs/sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}` });
    expect(Number(blob.size_bytes)).toBe(bytes.length);
    expect(await sha256OfObject(blobKey(sha256))).toEqual({ sha256, bytes: bytes.length });
    expect(await stagedKeys(fileId)).toEqual([]);
    expect(await groupUsedBytes(lab.groupId)).toBe(usedBefore + bytes.length);
    const audit = await db()('audit_log').where({ action: 'file.upload', target_id: fileId }).first();
    expect(audit).toMatchObject({ actor_user_id: lab.member.id, group_id: lab.groupId });
  });

  it('completing again answers the same verified file', async () => {
    const { file } = await completeUpload({ user: lab.member, fileId });
    expect(file).toMatchObject({ id: fileId, uploadState: 'verified', sha256 });
  });

  it('the same bytes in another version are stored once and counted once', async () => {
    const usedBefore = await groupUsedBytes(lab.groupId);
    const otherVersion = await createDraft(lab);
    const begin = await beginUpload({ user: lab.member, versionId: otherVersion, input: { name: 'copy-of-raw.bin', sizeBytes: bytes.length, sha256 } });
    await putParts(begin, begin.parts, bytes);
    const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId });
    expect(file).toMatchObject({ uploadState: 'verified', sha256 });
    expect(Number((await db()('blobs').where({ sha256 }).count({ n: '*' }).first())?.n)).toBe(1);
    expect(Number((await db()('files').where({ sha256 }).count({ n: '*' }).first())?.n)).toBe(2);
    expect(await groupUsedBytes(lab.groupId)).toBe(usedBefore);
    expect(await stagedKeys(begin.fileId)).toEqual([]);

    // Removing one copy keeps the shared content; removing the last one frees it and the group's storage.
    await removeFile({ user: lab.member, fileId });
    expect(await db()('blobs').where({ sha256 }).first()).toBeDefined();
    expect(await objectExists(defaultStore(), blobKey(sha256))).toBe(true);
    expect(await groupUsedBytes(lab.groupId)).toBe(usedBefore);
    await removeFile({ user: lab.member, fileId: begin.fileId });
    expect(await db()('blobs').where({ sha256 }).first()).toBeUndefined();
    expect(await objectExists(defaultStore(), blobKey(sha256))).toBe(false);
    expect(await groupUsedBytes(lab.groupId)).toBe(usedBefore - bytes.length);
    expect(await listFileViews(otherVersion)).toEqual([]);
  });
});

describe('small files, roles and names', () => {
  it('a one-part text file is verified, queued for analysis, and its role can change', async () => {
    const versionId = await createDraft(lab);
    const text = Buffer.from('T (K),R (Ohm)\n300,1.5\n4.2,0.01\n');
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'rt.csv', sizeBytes: text.length, sha256: sha256Hex(text) } });
    expect(begin.partCount).toBe(1);
    await putParts(begin, begin.parts, text);
    const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId });
    expect(file).toMatchObject({ uploadState: 'verified', role: 'raw' });
    expect(['queued', 'running', 'done']).toContain(file.analysisState); // the stack's worker may be on it already
    const changed = await updateFile({ user: lab.member, fileId: begin.fileId, input: { role: 'processed' } });
    expect(changed.file.role).toBe('processed');
    const bad = await updateFile({ user: lab.member, fileId: begin.fileId, input: { role: 'final' } }).catch((e: unknown) => e);
    expect((bad as AppError).code).toBe('validation_failed');
    expect((bad as AppError).details?.fieldErrors?.role).toBe('This field must be one of: raw, processed, other.');
  });

  it('an empty file is one empty part with the SHA-256 of nothing', async () => {
    const versionId = await createDraft(lab);
    const empty = new Uint8Array(0);
    // SHA-256 of the empty string (FIPS 180-4 test vector).
    const sha256 = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';
    expect(sha256Hex(empty)).toBe(sha256);
    const begin = await beginUpload({ user: lab.member, versionId, input: { name: 'notes.txt', sizeBytes: 0, sha256 } });
    expect(begin.partCount).toBe(1);
    await putParts(begin, begin.parts, empty);
    const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId });
    expect(file).toMatchObject({ uploadState: 'verified', sizeBytes: 0, sha256 });
    // Queued for analysis; the stack's worker may already have taken it, and an empty table fails analysis.
    expect(['queued', 'running', 'failed']).toContain(file.analysisState);
  });

  it('keeps names with ../, / and control characters as given and never puts them in a storage key', async () => {
    const versionId = await createDraft(lab);
    for (const name of ['../../etc/passwd', 'run 3/sweep up.csv', 'bell\u0007tab\there\u001b[31m.dat', '  spaced out.csv  ']) {
      const content = randomBytes(64);
      const begin = await beginUpload({ user: lab.member, versionId, input: { name, sizeBytes: content.length, sha256: sha256Hex(content) } });
      expect(begin.parts[0]!.url).not.toContain(encodeURIComponent(name.trim()));
      await putParts(begin, begin.parts, content);
      const { file } = await completeUpload({ user: lab.member, fileId: begin.fileId });
      expect(file.name).toBe(name.trim());
      const row = await db()('files').where({ id: begin.fileId }).first('name', 'staging_key');
      expect(row).toEqual({ name: name.trim(), staging_key: null });
      expect(blobKey(file.sha256!)).toMatch(/^blobs\/sha256\/[0-9a-f]{2}\/[0-9a-f]{2}\/[0-9a-f]{64}$/);
    }
    expect((await listFileViews(versionId)).map((f) => f.name).sort()).toEqual(
      ['../../etc/passwd', 'run 3/sweep up.csv', 'bell\u0007tab\there\u001b[31m.dat', 'spaced out.csv'].sort(),
    );
  });

  it.each([
    ['nul\u0000byte.csv', 'The file name contains a NUL character, which no file system accepts. Rename the file.'],
    ['   ', 'The file name is empty.'],
    ['x'.repeat(256), 'The file name is longer than 255 characters. Shorten it.'],
    ['half\uD800.csv', 'The file name is not valid Unicode text. Rename the file.'],
  ])('refuses the name %j with 422 and stores nothing', async (name, message) => {
    const versionId = await createDraft(lab);
    const error = await beginUpload({ user: lab.member, versionId, input: { name, sizeBytes: 1, sha256: 'a'.repeat(64) } }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe('validation_failed');
    expect((error as AppError).details?.fieldErrors?.name).toBe(message);
    expect(await listFileViews(versionId)).toEqual([]);
  });

  it('refuses a verified duplicate name with 409 and replaces a pending one', async () => {
    const versionId = await createDraft(lab);
    const content = randomBytes(100);
    const input = { name: 'hall-bar.csv', sizeBytes: content.length, sha256: sha256Hex(content) };
    const abandoned = await beginUpload({ user: lab.member, versionId, input });
    await putParts(abandoned, abandoned.parts, content);
    const begin = await beginUpload({ user: lab.member, versionId, input });
    expect((await listFileViews(versionId)).map((f) => f.id)).toEqual([begin.fileId]);
    expect(await stagedKeys(abandoned.fileId)).toEqual([]);
    await putParts(begin, begin.parts, content);
    await completeUpload({ user: lab.member, fileId: begin.fileId });
    const dup = await beginUpload({ user: lab.member, versionId, input }).catch((e: unknown) => e);
    expect((dup as AppError).code).toBe('conflict');
    expect((dup as AppError).message).toBe('A file named “hall-bar.csv” is already in this version. Remove it first, or give this one another name.');
    expect((dup as AppError).details).toMatchObject({ fileId: begin.fileId });
  });

  it('refuses people outside the group (hidden draft: 404) and changes nothing', async () => {
    const versionId = await createDraft(lab);
    const error = await beginUpload({ user: lab.outsider, versionId, input: { name: 'a.csv', sizeBytes: 1, sha256: 'b'.repeat(64) } }).catch((e: unknown) => e);
    expect((error as { status?: number }).status).toBe(404);
    expect(await listFileViews(versionId)).toEqual([]);
  });
});
