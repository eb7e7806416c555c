import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';

// manifest.json: what a backup folder holds, so a restore can check every byte before and after it loads anything.

export const MANIFEST_FORMAT = 'ohmstead-backup/1';
export const DUMP_FILE = 'database.sql';
export const OBJECTS_DIR = 'objects';

export type ObjectEntry = { key: string; sizeBytes: number; sha256: string };

export type BackupManifest = {
  format: typeof MANIFEST_FORMAT;
  createdAt: string;
  source: { database: string; databaseHost: string; bucket: string; s3Endpoint: string };
  database: { file: string; sizeBytes: number; sha256: string };
  /** Every object of the bucket; its bytes are in objects/<sha256> (one file per distinct content). */
  objects: ObjectEntry[];
  /** Objects listed but gone before they could be read (deleted meanwhile); not an error, but recorded. */
  skippedObjects: { key: string; reason: string }[];
  totals: { objects: number; objectBytes: number };
};

const SHA256 = /^[0-9a-f]{64}$/;

/** The file holding an object's bytes; named by digest, so a key can never steer the path. */
export function objectFile(folder: string, sha256: string): string {
  if (!SHA256.test(sha256)) throw new Error(`manifest digest "${sha256}" is not a SHA-256`);
  return path.join(folder, OBJECTS_DIR, sha256);
}

export async function writeManifest(folder: string, manifest: BackupManifest): Promise<void> {
  await writeFile(path.join(folder, 'manifest.json'), JSON.stringify(manifest, null, 2) + '\n', { mode: 0o600 });
}

export async function readManifest(folder: string): Promise<BackupManifest> {
  let parsed: unknown;
  try {
    parsed = JSON.parse(await readFile(path.join(folder, 'manifest.json'), 'utf8'));
  } catch (error) {
    throw new Error(`${folder} has no readable manifest.json (${error instanceof Error ? error.message : String(error)}); is it a backup folder?`);
  }
  const m = parsed as Partial<BackupManifest>;
  if (m.format !== MANIFEST_FORMAT) throw new Error(`manifest.json is format ${String(m.format)}; this version restores ${MANIFEST_FORMAT}.`);
  if (!m.database || !SHA256.test(m.database.sha256) || !Array.isArray(m.objects)) throw new Error('manifest.json is incomplete.');
  for (const o of m.objects) {
    if (typeof o.key !== 'string' || !o.key || !SHA256.test(o.sha256) || !Number.isInteger(o.sizeBytes) || o.sizeBytes < 0) {
      throw new Error(`manifest.json has a malformed object entry: ${JSON.stringify(o).slice(0, 200)}`);
    }
  }
  return m as BackupManifest;
}

/** backups/2026-12-02T213455Z: the instant in UTC, sortable, safe in any file system. */
export function backupFolderName(now: Date): string {
  return now.toISOString().replace(/\.\d{3}Z$/, 'Z').replace(/:/g, '');
}
