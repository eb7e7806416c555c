// Unpacks a zipped bag into a directory with yauzl, which refuses absolute paths, ".." and "\" in entry names.
import { createWriteStream } from 'node:fs';
import { mkdir, readdir } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import yauzl, { type Entry } from 'yauzl';

const S_IFMT = 0o170000;
const S_IFLNK = 0o120000;

export class UnsafeZipError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UnsafeZipError';
  }
}

/** The entry's destination, after checking (again, beyond yauzl) that it stays inside destDir. */
function destination(destDir: string, entry: Entry): string {
  const target = path.resolve(destDir, entry.fileName);
  const rel = path.relative(destDir, target);
  if (rel === '' || rel.startsWith('..') || path.isAbsolute(rel)) throw new UnsafeZipError(`zip entry ${JSON.stringify(entry.fileName)} would be written outside the bag`);
  if (((entry.externalFileAttributes >>> 16) & S_IFMT) === S_IFLNK)
    throw new UnsafeZipError(`zip entry ${JSON.stringify(entry.fileName)} is a symbolic link; a bag holds regular files only`);
  return target;
}

/** Extracts every entry of zipPath into destDir (which must exist and be empty); rejects on any unsafe or broken entry. */
export async function extractZip(zipPath: string, destDir: string): Promise<void> {
  const root = path.resolve(destDir);
  // strictFileNames: a backslash in a name is an error, not silently turned into a folder separator.
  const zip = await yauzl.openPromise(zipPath, { autoClose: false, strictFileNames: true, validateEntrySizes: true });
  try {
    for await (const entry of zip.eachEntry()) {
      const target = destination(root, entry);
      if (entry.fileName.endsWith('/')) {
        await mkdir(target, { recursive: true });
        continue;
      }
      await mkdir(path.dirname(target), { recursive: true });
      // flag 'wx': a second entry with the same name is refused rather than silently replacing the first.
      await pipeline(await zip.openReadStreamPromise(entry), createWriteStream(target, { flags: 'wx' }));
    }
  } finally {
    zip.close();
  }
}

/** The bag's base directory inside an extracted zip: the root itself, or its single top-level folder. */
export async function findBagRoot(extractedDir: string): Promise<string> {
  const entries = await readdir(extractedDir, { withFileTypes: true });
  if (entries.some((e) => e.name === 'bagit.txt')) return extractedDir;
  if (entries.length === 1 && entries[0]!.isDirectory()) return path.join(extractedDir, entries[0]!.name);
  return extractedDir;
}
