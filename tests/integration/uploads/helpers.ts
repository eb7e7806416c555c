// Shared set-up for the upload tests: an invented lab with its own quota, a member, drafts, and a browser-like PUT.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { createServer } from 'node:net';
import { db } from '@/lib/db';
import type { BeginUploadResult } from '@/lib/uploads/begin-upload';
import { listObjects, defaultStore } from '@/lib/storage/objects';
import { removeFile } from '@/lib/uploads/remove-file';
import { uniqueEmail } from '@/tests/support/unique';

export type TestUser = { id: string; siteRole: 'admin' | 'user'; name: string };
export type TestLab = { groupId: string; slug: string; member: TestUser; outsider: TestUser; versionIds: string[] };

const created: TestLab[] = [];

async function insertUser(name: string): Promise<TestUser> {
  const id = randomUUID();
  await db()('users').insert({ id, email: uniqueEmail('uploads'), name, site_role: 'user', email_verified_at: new Date() });
  return { id, siteRole: 'user', name };
}

/** A fresh group (quota in bytes) with one member and one user from outside; removed again by dropTestLabs(). */
export async function createTestLab(quotaBytes = 50 * 1024 ** 3): Promise<TestLab> {
  const groupId = randomUUID();
  const slug = `upload-test-${randomBytes(4).toString('hex')}`;
  await db()('groups').insert({ id: groupId, slug, name: `Quillon Upload Test Lab ${slug.slice(-8)}`, storage_quota_bytes: quotaBytes });
  const member = await insertUser('Tamsin Brake');
  const outsider = await insertUser('Orrin Vale');
  await db()('memberships').insert({ group_id: groupId, user_id: member.id, role: 'member' });
  const lab = { groupId, slug, member, outsider, versionIds: [] };
  created.push(lab);
  return lab;
}

/** A draft version 1 of a new dataset in the lab, with the given metadata record. */
export async function createDraft(lab: TestLab, metadata: Record<string, unknown> = { title: 'Upload test draft' }): Promise<string> {
  const datasetId = randomUUID();
  const versionId = randomUUID();
  await db()('datasets').insert({ id: datasetId, group_id: lab.groupId, created_by: lab.member.id });
  await db()('dataset_versions').insert({
    id: versionId, dataset_id: datasetId, version_number: 1, state: 'draft', title: String(metadata.title ?? 'Upload test draft'),
    metadata: JSON.stringify(metadata), created_by: lab.member.id,
  });
  lab.versionIds.push(versionId);
  return versionId;
}

export const sha256Hex = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** PUTs each part the way the browser does (fetch, body = the slice) and returns the ETag header of each. */
export async function putParts(begin: Pick<BeginUploadResult, 'partSizeBytes'>, urls: { partNumber: number; url: string }[], bytes: Uint8Array) {
  const etags: { partNumber: number; etag: string }[] = [];
  for (const { partNumber, url } of urls) {
    const start = (partNumber - 1) * begin.partSizeBytes;
    const res = await fetch(url, { method: 'PUT', body: new Uint8Array(bytes.subarray(start, start + begin.partSizeBytes)) });
    if (res.status !== 200) throw new Error(`PUT part ${partNumber} answered ${res.status}: ${await res.text()}`);
    etags.push({ partNumber, etag: res.headers.get('etag') ?? '' });
  }
  return etags;
}

export async function stagedKeys(fileId: string): Promise<string[]> {
  return (await listObjects(defaultStore(), `staging/${fileId}/`)).map((o) => o.key);
}

export async function groupUsedBytes(groupId: string): Promise<number> {
  return Number((await db()('groups').where({ id: groupId }).first('storage_used_bytes')).storage_used_bytes);
}

/** An endpoint where nothing listens: a port the OS just gave out and took back. */
export async function closedPortUrl(): Promise<string> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return `http://127.0.0.1:${port}`;
}

/** Removes what the tests made: verified files through removeFile (so blobs and objects go too), then the rows. */
export async function dropTestLabs(): Promise<void> {
  for (const lab of created.splice(0)) {
    const files: { id: string }[] = lab.versionIds.length ? await db()('files').whereIn('version_id', lab.versionIds).select('id') : [];
    for (const f of files) await removeFile({ user: lab.member, fileId: f.id }).catch(() => undefined);
    if (lab.versionIds.length) {
      await db()('files').whereIn('version_id', lab.versionIds).delete();
      const datasets = await db()('dataset_versions').whereIn('id', lab.versionIds).pluck('dataset_id');
      await db()('datasets').whereIn('id', datasets).delete();
    }
    await db()('groups').where({ id: lab.groupId }).delete();
    await db()('users').whereIn('id', [lab.member.id, lab.outsider.id]).delete();
  }
}

export async function closeDb(): Promise<void> {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
}
