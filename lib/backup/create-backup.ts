import 'server-only';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { assertLoopbackDatabase } from '@/db/loopback-guard';
import { env } from '@/lib/env';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import { dbTarget, dumpDatabase } from './mariadb-cli';
import { backupFolderName, DUMP_FILE, MANIFEST_FORMAT, OBJECTS_DIR, writeManifest, type BackupManifest } from './manifest';
import { copyObjectsOut } from './object-files';

/** The dated name, or name-2, name-3 … when a backup of the same second exists; its .partial folder is made. */
async function freeFolderName(root: string, base: string): Promise<string> {
  for (let n = 1; n <= 50; n++) {
    const name = n === 1 ? base : `${base}-${n}`;
    const taken = await stat(path.join(root, name)).then(() => true, () => false);
    if (!taken && (await mkdir(path.join(root, `${name}.partial`)).then(() => true, () => false))) return name;
  }
  throw new Error(`cannot make a backup folder in ${root}`);
}

export type CreateBackupOptions = {
  /** Where dated backup folders go (the project's backups/ for `npm run backup`). */
  rootDir: string;
  now?: Date;
  store?: ObjectStore;
  log?: (line: string) => void;
};

/**
 * Backs up the configured database and bucket into <rootDir>/<UTC instant>/: database.sql (mariadb-dump, one
 * consistent snapshot), objects/<sha256> and manifest.json. The database goes first, so every object its rows name
 * already exists when the bucket is listed. Written as <name>.partial and renamed when complete.
 */
export async function createBackup(opts: CreateBackupOptions): Promise<{ folder: string; manifest: BackupManifest }> {
  const log = opts.log ?? (() => undefined);
  const e = env();
  if (e.OHMSTEAD_ALLOW_REMOTE_DB !== '1') assertLoopbackDatabase(e.DATABASE_URL);
  const store = opts.store ?? defaultStore();
  const now = opts.now ?? new Date();
  const target = dbTarget(e.DATABASE_URL);

  await mkdir(opts.rootDir, { recursive: true });
  const name = await freeFolderName(opts.rootDir, backupFolderName(now));
  const partial = path.join(opts.rootDir, `${name}.partial`);
  try {
    await mkdir(path.join(partial, OBJECTS_DIR));
    log(`dumping database ${target.database} from ${target.host}:${target.port}`);
    const dump = await dumpDatabase(target, path.join(partial, DUMP_FILE));
    log(`  ${dump.sizeBytes} bytes, SHA-256 ${dump.sha256}`);
    log(`copying objects of bucket ${store.bucket}`);
    const { objects, skipped } = await copyObjectsOut(store, partial, log);
    const objectBytes = objects.reduce((sum, o) => sum + o.sizeBytes, 0);
    log(`  ${objects.length} objects, ${objectBytes} bytes`);
    const manifest: BackupManifest = {
      format: MANIFEST_FORMAT,
      createdAt: now.toISOString(),
      source: { database: target.database, databaseHost: `${target.host}:${target.port}`, bucket: store.bucket, s3Endpoint: e.S3_ENDPOINT },
      database: { file: DUMP_FILE, ...dump },
      objects,
      skippedObjects: skipped,
      totals: { objects: objects.length, objectBytes },
    };
    await writeManifest(partial, manifest);
    const folder = path.join(opts.rootDir, name);
    await rename(partial, folder);
    return { folder, manifest };
  } catch (error) {
    await rm(partial, { recursive: true, force: true });
    throw error;
  }
}
