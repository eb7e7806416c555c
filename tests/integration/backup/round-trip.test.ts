// npm run backup / restore as library calls: back up the configured database and bucket into a temp folder, restore
// into a scratch database on the same MariaDB and a scratch key prefix in the same bucket, then compare every
// dataset, version DOI, file digest and stored object. Other tests write to the same services meanwhile, so rows
// changed after the backup started are left out of the comparison; our own dataset must come back exactly.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexConfig } from '@/knexfile';
import { createBackup } from '@/lib/backup/create-backup';
import { digestObject } from '@/lib/backup/object-files';
import { restoreBackup } from '@/lib/backup/restore-backup';
import type { BackupManifest } from '@/lib/backup/manifest';
import { db } from '@/lib/db';
import { defaultStore, deleteObjects, deletePrefix } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { blobKey } from '@/lib/uploads/complete-upload';
import { assertLoopback, requireEnv } from '@/tests/support/services';

const tag = randomBytes(4).toString('hex');
const scratchDb = `ohmstead_restore_${tag}`;
const keyPrefix = `restore-test-${tag}/`;
const root = mkdtempSync(path.join(os.tmpdir(), 'ohmstead-backup-'));
const ours = { groupId: randomUUID(), datasetId: randomUUID(), versionId: randomUUID(), fileId: randomUUID(), doi: `10.80123/bk-${tag}`, conceptDoi: `10.80123/bkc-${tag}` };
// Invented measurement text; its digest is computed here, the store must give the same bytes back.
const content = Buffer.from(`# T_K,R_ohm\n${Array.from({ length: 400 }, (_, i) => `${(2 + i * 0.5).toFixed(1)},${(0.0123 + i * 1e-5).toFixed(6)}`).join('\n')}\n`);
const sha256 = createHash('sha256').update(content).digest('hex');
let restored: Knex;
let manifest: BackupManifest;
let folder: string;
let startedAt: Date;

beforeAll(async () => {
  assertLoopback(requireEnv('DATABASE_URL'), 'database');
  await putObject(defaultStore(), blobKey(sha256), content);
  await db()('blobs').insert({ sha256, size_bytes: content.length, storage_key: blobKey(sha256) }).onConflict('sha256').ignore();
  await db()('groups').insert({ id: ours.groupId, slug: `backup-bench-${tag}`, name: `Saltmarsh Backup Bench ${tag} (invented)` });
  await db()('datasets').insert({ id: ours.datasetId, group_id: ours.groupId, concept_doi: ours.conceptDoi });
  await db()('dataset_versions').insert({
    id: ours.versionId, dataset_id: ours.datasetId, version_number: 1, state: 'published', title: `R(T) of a backup-test wire ${tag}`,
    metadata: JSON.stringify({ title: `R(T) of a backup-test wire ${tag}`, keywords: ['résistance', '電気抵抗'] }), doi: ours.doi, doi_state: 'findable',
    published_at: new Date('2026-11-30T12:00:00Z'),
  });
  await db()('files').insert({ id: ours.fileId, version_id: ours.versionId, name: 'r_vs_t.csv', size_bytes: content.length, sha256, upload_state: 'verified' });
});

afterAll(async () => {
  await restored?.destroy();
  await db().raw(`DROP DATABASE IF EXISTS \`${scratchDb}\``);
  await deletePrefix(defaultStore(), keyPrefix);
  await db()('datasets').where({ id: ours.datasetId }).delete();
  await db()('groups').where({ id: ours.groupId }).delete();
  // The blob may be shared with identical content elsewhere only by chance of the same bytes; ours carry the tag.
  if (!(await db()('files').where({ sha256 }).first())) {
    await db()('blobs').where({ sha256 }).delete();
    await deleteObjects(defaultStore(), [blobKey(sha256)]);
  }
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
  rmSync(root, { recursive: true, force: true });
});

const toIso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);
/** Rows of the live database that nobody changed since the backup began (DATETIME keeps whole seconds). */
const unchanged = <T extends { updated_at: Date }>(rows: T[]): T[] => rows.filter((r) => new Date(r.updated_at).getTime() < Math.floor(startedAt.getTime() / 1000) * 1000);

describe('backup and restore', () => {
  it('round-trips the database and the bucket', { timeout: 600_000 }, async () => {
    startedAt = new Date();
    ({ folder, manifest } = await createBackup({ rootDir: root }));
    expect(path.basename(folder)).toMatch(/^\d{4}-\d{2}-\d{2}T\d{6}Z(-\d+)?$/);
    const entry = manifest.objects.find((o) => o.key === blobKey(sha256));
    expect(entry).toEqual({ key: blobKey(sha256), sizeBytes: content.length, sha256 });

    const result = await restoreBackup({ folder, database: scratchDb, keyPrefix });
    expect(result.database).toBe(scratchDb);
    restored = knexFactory(knexConfig(requireEnv('DATABASE_URL').replace(/\/[^/]*$/, `/${scratchDb}`)));

    // Our dataset comes back exactly, DOIs and all.
    const v = await restored('dataset_versions').where({ id: ours.versionId }).first();
    expect(v).toMatchObject({ dataset_id: ours.datasetId, state: 'published', doi: ours.doi, doi_state: 'findable', title: `R(T) of a backup-test wire ${tag}` });
    expect(typeof v.metadata === 'string' ? JSON.parse(v.metadata) : v.metadata).toEqual({ title: `R(T) of a backup-test wire ${tag}`, keywords: ['résistance', '電気抵抗'] });
    expect(toIso(v.published_at)).toBe('2026-11-30T12:00:00.000Z');
    expect((await restored('datasets').where({ id: ours.datasetId }).first()).concept_doi).toBe(ours.conceptDoi);
    expect(await restored('files').where({ id: ours.fileId }).first('sha256', 'size_bytes', 'name')).toEqual({ sha256, size_bytes: content.length, name: 'r_vs_t.csv' });
    expect(await digestObject(defaultStore(), keyPrefix + blobKey(sha256))).toEqual({ sha256, sizeBytes: content.length });
  });

  it('brings back every dataset, version DOI and file digest that existed when the backup began', async () => {
    const sourceDatasets = await db()('datasets').where('created_at', '<', startedAt).select('id', 'group_id', 'concept_doi', 'updated_at');
    const restoredDatasets = new Map((await restored('datasets').select('id', 'group_id', 'concept_doi')).map((d) => [d.id, d]));
    expect(sourceDatasets.length).toBeGreaterThan(1);
    for (const d of sourceDatasets) expect(restoredDatasets.get(d.id)).toEqual({ id: d.id, group_id: d.group_id, concept_doi: d.concept_doi });

    const columns = ['id', 'dataset_id', 'version_number', 'state', 'title', 'doi', 'doi_state', 'metadata', 'published_at', 'updated_at'];
    const sourceVersions = unchanged(await db()('dataset_versions').select(columns));
    const restoredVersions = new Map((await restored('dataset_versions').select(columns)).map((r) => [r.id, r]));
    expect(sourceVersions.some((s) => s.doi)).toBe(true);
    for (const s of sourceVersions) expect(restoredVersions.get(s.id)).toEqual(s);

    const fileColumns = ['id', 'version_id', 'name', 'sha256', 'size_bytes', 'upload_state', 'updated_at'];
    const sourceFiles = unchanged(await db()('files').select(fileColumns));
    const restoredFiles = new Map((await restored('files').select(fileColumns)).map((r) => [r.id, r]));
    expect(sourceFiles.length).toBeGreaterThan(0);
    for (const s of sourceFiles) expect(restoredFiles.get(s.id)).toEqual(s);
  });

  it('restores every blob’s object with the SHA-256 its row records', { timeout: 300_000 }, async () => {
    const byKey = new Map(manifest.objects.map((o) => [o.key, o]));
    const blobs: { sha256: string; size_bytes: number; storage_key: string }[] = await restored('blobs').select('sha256', 'size_bytes', 'storage_key');
    expect(blobs.length).toBeGreaterThan(0);
    for (const b of blobs) {
      if (manifest.skippedObjects.some((s) => s.key === b.storage_key)) continue; // deleted by another test meanwhile
      expect(byKey.get(b.storage_key)).toEqual({ key: b.storage_key, sizeBytes: Number(b.size_bytes), sha256: b.sha256 });
      expect(await digestObject(defaultStore(), keyPrefix + b.storage_key)).toEqual({ sha256: b.sha256, sizeBytes: Number(b.size_bytes) });
    }
    const migrations = async (k: Knex) => (await k('knex_migrations').orderBy('id').select('name')).map((m) => m.name);
    const restoredMigrations = await migrations(restored);
    expect(restoredMigrations.length).toBeGreaterThan(1);
    expect(restoredMigrations).toEqual(await migrations(db()));
  });

  it('refuses a database that has tables (unless told to replace it) and a damaged dump', async () => {
    await expect(restoreBackup({ folder, database: scratchDb, keyPrefix })).rejects.toThrow(`database ${scratchDb} already has tables`);
    writeFileSync(path.join(folder, 'database.sql'), '-- not the dump\n');
    await expect(restoreBackup({ folder, database: `${scratchDb}_x`, keyPrefix, replace: true })).rejects.toThrow('does not match manifest.json');
    const made = await db().raw('SELECT COUNT(*) AS n FROM information_schema.SCHEMATA WHERE SCHEMA_NAME = ?', [`${scratchDb}_x`]);
    expect(Number(made[0][0].n)).toBe(0);
  });
});
