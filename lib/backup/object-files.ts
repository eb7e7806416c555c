import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { listObjects, ObjectMissingError, readObject, type ObjectStore } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { objectFile, OBJECTS_DIR, type ObjectEntry } from './manifest';

async function exists(file: string): Promise<boolean> {
  return stat(file).then(() => true, () => false);
}

/** SHA-256 and size of a local file, streamed. */
export async function digestFile(file: string): Promise<{ sha256: string; sizeBytes: number }> {
  const hash = createHash('sha256');
  let sizeBytes = 0;
  for await (const chunk of createReadStream(file) as AsyncIterable<Buffer>) {
    hash.update(chunk);
    sizeBytes += chunk.length;
  }
  return { sha256: hash.digest('hex'), sizeBytes };
}

/** SHA-256 and size of a stored object, streamed from the store. */
export async function digestObject(store: ObjectStore, key: string): Promise<{ sha256: string; sizeBytes: number }> {
  const hash = createHash('sha256');
  let sizeBytes = 0;
  for await (const chunk of (await readObject(store, key)).body) {
    hash.update(chunk);
    sizeBytes += chunk.length;
  }
  return { sha256: hash.digest('hex'), sizeBytes };
}

/** Copies every object of the store into <folder>/objects/<sha256>, hashing on the way. */
export async function copyObjectsOut(store: ObjectStore, folder: string, log: (line: string) => void) {
  const objects: ObjectEntry[] = [];
  const skipped: { key: string; reason: string }[] = [];
  for (const listed of await listObjects(store, '')) {
    const tmp = path.join(folder, OBJECTS_DIR, `.incoming-${randomBytes(6).toString('hex')}`);
    const hash = createHash('sha256');
    let sizeBytes = 0;
    try {
      const read = await readObject(store, listed.key);
      await pipeline(
        (async function* () {
          for await (const chunk of read.body) {
            hash.update(chunk);
            sizeBytes += chunk.length;
            yield chunk;
          }
        })(),
        createWriteStream(tmp, { mode: 0o600 }),
      );
    } catch (error) {
      await rm(tmp, { force: true });
      if (!(error instanceof ObjectMissingError)) throw error;
      skipped.push({ key: listed.key, reason: 'deleted after it was listed' });
      log(`  skipped ${listed.key}: deleted after it was listed`);
      continue;
    }
    const sha256 = hash.digest('hex');
    const target = objectFile(folder, sha256);
    if (await exists(target)) await rm(tmp);
    else await rename(tmp, target);
    objects.push({ key: listed.key, sizeBytes, sha256 });
  }
  return { objects, skipped };
}

/**
 * Uploads each manifest object from the folder under `keyPrefix` + key: the local file is checked against the
 * manifest first, and the stored copy is read back and checked after.
 */
export async function copyObjectsIn(store: ObjectStore, folder: string, entries: ObjectEntry[], keyPrefix: string, log: (line: string) => void): Promise<void> {
  for (const [i, entry] of entries.entries()) {
    const file = objectFile(folder, entry.sha256);
    const local = await digestFile(file).catch(() => null);
    if (!local || local.sha256 !== entry.sha256 || local.sizeBytes !== entry.sizeBytes) {
      throw new Error(`backup file for ${entry.key} is missing or damaged (expected SHA-256 ${entry.sha256}, ${entry.sizeBytes} bytes)`);
    }
    const key = keyPrefix + entry.key;
    await putObject(store, key, createReadStream(file), { sizeBytes: entry.sizeBytes });
    const stored = await digestObject(store, key);
    if (stored.sha256 !== entry.sha256 || stored.sizeBytes !== entry.sizeBytes) {
      throw new Error(`${key} was stored with SHA-256 ${stored.sha256} (${stored.sizeBytes} bytes), not ${entry.sha256}`);
    }
    if ((i + 1) % 100 === 0) log(`  ${i + 1} of ${entries.length} objects restored`);
  }
}
