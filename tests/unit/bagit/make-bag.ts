// Writes small bags by hand (independently of lib/packages) so the verifier is tested against bytes we control.
import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { crc32 } from 'node:zlib';

// Every bag and zip of one test file goes under one scratch folder, removed by removeScratch() in afterAll.
let scratch: string | undefined;
const scratchDir = (prefix: string) => mkdtempSync(path.join((scratch ??= mkdtempSync(path.join(tmpdir(), 'ohm-bag-tests-'))), prefix));
export function removeScratch(): void {
  if (scratch) rmSync(scratch, { recursive: true, force: true });
  scratch = undefined;
}

export const digest = (algorithm: string, data: string | Buffer) => createHash(algorithm).update(data).digest('hex');

export type BagSpec = {
  payload: Record<string, string>;
  algorithms?: string[];
  bagInfo?: string;
  /** Replaces the manifest text of one algorithm (lines as written, already percent-encoded). */
  manifestText?: Record<string, string>;
  extraTagFiles?: Record<string, string>;
  tagManifest?: boolean;
};

/** The manifest path of a payload path: RFC 8493 §2.1.3 encoding written out here without the library. */
const encode = (p: string) => p.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A');

export function writeBag(spec: BagSpec): string {
  const root = scratchDir('bag-');
  const write = (rel: string, content: string | Buffer) => {
    mkdirSync(path.dirname(path.join(root, rel)), { recursive: true });
    writeFileSync(path.join(root, rel), content);
  };
  const tagFiles: Record<string, string> = { 'bagit.txt': 'BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n' };
  mkdirSync(path.join(root, 'data'));
  for (const [rel, content] of Object.entries(spec.payload)) write(`data/${rel}`, content);
  for (const algorithm of spec.algorithms ?? ['sha256']) {
    tagFiles[`manifest-${algorithm}.txt`] =
      spec.manifestText?.[algorithm] ??
      Object.entries(spec.payload).map(([rel, content]) => `${digest(algorithm, content)}  ${encode(`data/${rel}`)}\n`).join('');
  }
  if (spec.bagInfo !== undefined) tagFiles['bag-info.txt'] = spec.bagInfo;
  Object.assign(tagFiles, spec.extraTagFiles ?? {});
  for (const [rel, content] of Object.entries(tagFiles)) write(rel, content);
  if (spec.tagManifest !== false) {
    const lines = Object.entries(tagFiles).map(([rel, content]) => `${digest('sha256', content)}  ${encode(rel)}\n`);
    write('tagmanifest-sha256.txt', lines.join(''));
  }
  return root;
}

/** A zip with stored (uncompressed) entries whose names are written exactly as given, even unsafe ones (APPNOTE 6.3.10). */
export function writeRawZip(entries: { name: string; data: string; mode?: number }[]): string {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.from(e.name, 'utf8');
    const data = Buffer.from(e.data, 'utf8');
    const crc = crc32(data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6); // UTF-8 names
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(data.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE((3 << 8) | 20, 4); // made by Unix, so the external attributes carry a mode
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(data.length, 20);
    central.writeUInt32LE(data.length, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(((e.mode ?? 0o100644) << 16) >>> 0, 38);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, data);
    centrals.push(central, name);
    offset += local.length + name.length + data.length;
  }
  const cd = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(cd.length, 12);
  end.writeUInt32LE(offset, 16);
  const file = path.join(scratchDir('zip-'), 'bag.zip');
  writeFileSync(file, Buffer.concat([...locals, cd, end]));
  return file;
}
