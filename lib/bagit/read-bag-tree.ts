// Lists the regular files of a bag directory by their "/"-separated path, refusing anything that leads outside it.
import { createReadStream } from 'node:fs';
import { lstat, readdir, realpath, stat } from 'node:fs/promises';
import { createHash } from 'node:crypto';
import path from 'node:path';
import { showPath } from './bag-paths';

export type BagFile = { absPath: string; sizeBytes: number };
export type BagTree = { files: Map<string, BagFile>; directories: Set<string>; problems: string[] };

function inside(root: string, target: string): boolean {
  const rel = path.relative(root, target);
  return rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel));
}

/** Every regular file under root; a symbolic link counts only when it resolves to a regular file inside the bag. */
export async function readBagTree(root: string): Promise<BagTree> {
  const realRoot = await realpath(root);
  const tree: BagTree = { files: new Map(), directories: new Set(), problems: [] };
  async function walk(dir: string, prefix: string): Promise<void> {
    const entries = await readdir(dir, { withFileTypes: true });
    entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    for (const entry of entries) {
      const rel = prefix + entry.name;
      const abs = path.join(dir, entry.name);
      if (entry.isDirectory()) {
        tree.directories.add(rel);
        await walk(abs, `${rel}/`);
      } else if (entry.isFile()) {
        tree.files.set(rel, { absPath: abs, sizeBytes: (await lstat(abs)).size });
      } else if (entry.isSymbolicLink()) {
        const target = await realpath(abs).catch(() => undefined);
        const info = target ? await stat(target) : undefined;
        if (!target || !inside(realRoot, target)) tree.problems.push(`${showPath(rel)}: a symbolic link that leads outside the bag`);
        else if (!info?.isFile()) tree.problems.push(`${showPath(rel)}: a symbolic link to something that is not a regular file`);
        else tree.files.set(rel, { absPath: target, sizeBytes: info.size });
      } else {
        tree.problems.push(`${showPath(rel)}: not a regular file or directory`);
      }
    }
  }
  await walk(realRoot, '');
  return tree;
}

/** Hex digests of one file for several algorithms, in one read. */
export async function hashFile(absPath: string, algorithms: readonly string[]): Promise<Map<string, string>> {
  const hashes = algorithms.map((a) => [a, createHash(a)] as const);
  for await (const chunk of createReadStream(absPath, { highWaterMark: 1024 * 1024 })) {
    for (const [, h] of hashes) h.update(chunk as Buffer);
  }
  return new Map(hashes.map(([a, h]) => [a, h.digest('hex')]));
}
