import 'server-only';
import path from 'node:path';
import { assertLoopbackDatabase } from '@/db/loopback-guard';
import { env } from '@/lib/env';
import { defaultStore, type ObjectStore } from '@/lib/storage/objects';
import { createDatabase, dbTarget, loadDump, tableCount } from './mariadb-cli';
import { readManifest, type BackupManifest } from './manifest';
import { copyObjectsIn, digestFile } from './object-files';

export type RestoreOptions = {
  folder: string;
  /** Database to load into; default the configured one (DATABASE_URL). Made if missing. */
  database?: string;
  /** Drop and recreate the database when it already has tables; without it such a database is refused. */
  replace?: boolean;
  /** Prefix for every restored object key (a scratch area); default none, i.e. the same keys. */
  keyPrefix?: string;
  store?: ObjectStore;
  log?: (line: string) => void;
};

/**
 * Restores a backup folder: checks the dump's digest, loads it into the database (refusing one that has tables
 * unless `replace`), then uploads every object and checks each stored copy's SHA-256 against the manifest.
 */
export async function restoreBackup(opts: RestoreOptions): Promise<{ manifest: BackupManifest; database: string }> {
  const log = opts.log ?? (() => undefined);
  const e = env();
  if (e.OHMSTEAD_ALLOW_REMOTE_DB !== '1') assertLoopbackDatabase(e.DATABASE_URL);
  const manifest = await readManifest(opts.folder);
  const target = dbTarget(e.DATABASE_URL, opts.database);
  const store = opts.store ?? defaultStore();

  const dumpFile = path.join(opts.folder, path.basename(manifest.database.file));
  const dump = await digestFile(dumpFile).catch(() => null);
  if (!dump || dump.sha256 !== manifest.database.sha256 || dump.sizeBytes !== manifest.database.sizeBytes) {
    throw new Error(`${dumpFile} is missing or does not match manifest.json (SHA-256 ${manifest.database.sha256}); nothing was restored.`);
  }
  await createDatabase(target, { replace: false });
  if ((await tableCount(target)) > 0) {
    if (!opts.replace) {
      throw new Error(`database ${target.database} already has tables; restore into an empty or new database, or pass --replace to drop it first. Nothing was restored.`);
    }
    log(`dropping and recreating database ${target.database}`);
    await createDatabase(target, { replace: true });
  }
  log(`loading ${manifest.database.file} into ${target.database} on ${target.host}:${target.port}`);
  await loadDump(target, dumpFile);
  log(`uploading ${manifest.objects.length} objects to bucket ${store.bucket}${opts.keyPrefix ? ` under ${opts.keyPrefix}` : ''}`);
  await copyObjectsIn(store, opts.folder, manifest.objects, opts.keyPrefix ?? '', log);
  log('every object verified against its SHA-256');
  return { manifest, database: target.database };
}
