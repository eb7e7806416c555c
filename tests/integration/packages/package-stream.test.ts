// Packages streamed from the running s3rver: the verifier accepts them, a flipped byte or a missing object is caught,
// and a cancelled download stops reading from storage. Objects live under a unique prefix, removed afterwards.
import { randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { Socket } from 'node:net';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { verifyBag } from '@/lib/bagit/verify-bag';
import { buildPackageStream, PackageIntegrityError } from '@/lib/packages/build-package-stream';
import { defaultStore, deletePrefix, ObjectMissingError } from '@/lib/storage/objects';
import { putObject } from '@/lib/storage/put-object';
import { fileWithBytes, identifyingStrings, packageInput, referenceCrc32, RXX_CSV, RXY_CSV, type FileWithBytes } from '../../unit/packages/fixtures';

const MiB = 1024 * 1024;
const prefix = `test/packages/${randomBytes(6).toString('hex')}/`;
const store = () => defaultStore();
const put = async (f: FileWithBytes) => void (await putObject(store(), f.storageKey, f.bytes));

/** Reads a web stream to the end, handing each chunk to `each` (the DOM typings give ReadableStream no iterator). */
async function drain(stream: ReadableStream<Uint8Array>, each: (chunk: Uint8Array) => void): Promise<void> {
  const reader = stream.getReader();
  for (let r = await reader.read(); !r.done; r = await reader.read()) each(r.value);
}

async function collect(stream: ReadableStream<Uint8Array>): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  await drain(stream, (c) => chunks.push(c));
  return Buffer.concat(chunks);
}

const scratch = mkdtempSync(path.join(tmpdir(), 'ohm-pkg-it-'));

function saveZip(bytes: Buffer, name = 'package.zip'): string {
  const file = path.join(mkdtempSync(path.join(scratch, 'zip-')), name);
  writeFileSync(file, bytes);
  return file;
}

type ZipEntry = { name: string; method: number; crc32: number; bytes: Buffer };

/** Every entry of a zip: name, compression method (0 stored, 8 deflated), the CRC-32 it declares, and bytes. */
async function zipEntries(file: string): Promise<ZipEntry[]> {
  const zip = await yauzl.openPromise(file, { autoClose: false });
  const out: ZipEntry[] = [];
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const c of await zip.openReadStreamPromise(entry)) chunks.push(c as Buffer);
    out.push({ name: entry.fileName, method: entry.compressionMethod, crc32: entry.crc32, bytes: Buffer.concat(chunks) });
  }
  zip.close();
  return out;
}

const rxx = fileWithBytes('rxx_1p8K.csv', RXX_CSV, `${prefix}rxx`);
const rxy = fileWithBytes('100%\nrxy.csv', RXY_CSV, `${prefix}rxy`);
const rho = fileWithBytes('ρ(T) µΩ·cm.dat', 'T (K)\trho (uOhm.cm)\n300\t1.72\n', `${prefix}rho`, 'text/tab-separated-values');
const blob = fileWithBytes('lockin-raw.bin', randomBytes(MiB + 17), `${prefix}blob`, 'application/octet-stream');
const files = [rxx, rxy, rho, blob];

beforeAll(async () => {
  for (const f of files) await put(f);
});

afterAll(async () => {
  await deletePrefix(store(), prefix);
  rmSync(scratch, { recursive: true, force: true });
});

describe('a package streamed from storage', () => {
  let stored: string;

  it('is a valid BagIt bag (store mode): verifier passes, payload stored, tag files deflated, bagit.txt first', async () => {
    const pkg = buildPackageStream(packageInput(files));
    expect(pkg.fileName).toBe('ohmstead-ohm.k7p2-v2.zip');
    stored = saveZip(await collect(pkg.stream));
    const report = await verifyBag(stored);
    expect(report.problems).toEqual([]);
    expect(report).toMatchObject({ valid: true, payloadFiles: 4, payloadBytes: RXX_CSV.length + RXY_CSV.length + rho.sizeBytes + MiB + 17, algorithms: ['sha256'] });
    const entries = await zipEntries(stored);
    expect(entries[0]!.name).toBe('ohmstead-ohm.k7p2-v2/bagit.txt');
    // Names are UTF-8 in the zip (yauzl reads the language-encoding flag, APPNOTE 4.4.4 bit 11).
    expect(entries.map((e) => e.name).slice(-4)).toEqual([
      'ohmstead-ohm.k7p2-v2/data/rxx_1p8K.csv',
      'ohmstead-ohm.k7p2-v2/data/100%_rxy.csv',
      'ohmstead-ohm.k7p2-v2/data/ρ(T) µΩ·cm.dat',
      'ohmstead-ohm.k7p2-v2/data/lockin-raw.bin',
    ]);
    expect(entries.filter((e) => e.name.includes('/data/')).map((e) => e.method)).toEqual([0, 0, 0, 0]);
    expect(entries.find((e) => e.name.endsWith('/README.md'))!.method).toBe(8);
    expect(entries.find((e) => e.name.endsWith('/data/lockin-raw.bin'))!.bytes.equals(blob.bytes)).toBe(true);
    expect(entries.find((e) => e.name.endsWith('/manifest-sha256.txt'))!.bytes.toString()).toContain(`${rxy.sha256}  data/100%25_rxy.csv\n`);
    // yauzl does not check CRCs; a bitwise reference does (unzip tools reject an entry whose CRC-32 is wrong).
    expect(entries.map((e) => [e.name, e.crc32 >>> 0])).toEqual(entries.map((e) => [e.name, referenceCrc32(e.bytes)]));
  });

  it('is valid in deflate mode too, with the payload deflated', async () => {
    const zip = saveZip(await collect(buildPackageStream(packageInput(files), { compression: 'deflate', deflateLevel: 1 }).stream));
    expect((await verifyBag(zip)).problems).toEqual([]);
    const entries = await zipEntries(zip);
    expect(entries.filter((e) => e.name.includes('/data/')).map((e) => e.method)).toEqual([8, 8, 8, 8]);
    expect(entries.map((e) => [e.name, e.crc32 >>> 0])).toEqual(entries.map((e) => [e.name, referenceCrc32(e.bytes)]));
  });

  it('fails verification when one payload byte is changed in the zip', async () => {
    const bytes = readFileSync(stored);
    const at = bytes.indexOf('0.0,98.50,1.80');
    expect(at).toBeGreaterThan(0);
    bytes.write('0.0,98.60,1.80', at);
    const tampered = RXX_CSV.replace('98.50', '98.60');
    const report = await verifyBag(saveZip(bytes, 'tampered.zip'));
    expect(report.valid).toBe(false);
    expect(report.problems).toEqual([
      `data/rxx_1p8K.csv: sha256 is ${fileWithBytes('x', tampered).sha256}, the manifest says ${rxx.sha256}`,
    ]);
  });

  it('has no creator, group or affiliation string in any entry, payload included, when anonymous', async () => {
    const input = packageInput(files, { anonymous: true });
    const entries = await zipEntries(saveZip(await collect(buildPackageStream(input).stream)));
    expect(entries).toHaveLength(13);
    const leaks = entries.flatMap((e) => identifyingStrings(input).filter((s) => e.bytes.toString('latin1').toLowerCase().includes(s.toLowerCase())).map((s) => `${e.name}: ${s}`));
    expect(leaks).toEqual([]);
  });
});

describe('faults', () => {
  it('errors the stream loudly, before the zip is complete, when an object is missing from storage', async () => {
    const missing = fileWithBytes('gone.csv', 'never stored', `${prefix}does-not-exist`);
    const chunks: Uint8Array[] = [];
    const read = drain(buildPackageStream(packageInput([rxx, missing])).stream, (c) => chunks.push(c));
    await expect(read).rejects.toThrow(ObjectMissingError);
    await expect(read).rejects.toThrow(`object ${prefix}does-not-exist does not exist`);
    // No end-of-central-directory record (PK\x05\x06, APPNOTE 4.3.16): no unzip tool takes this for a whole archive.
    expect(Buffer.concat(chunks).includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]))).toBe(false);
  });

  it('errors when storage holds a different size than the database lists', async () => {
    const wrong = { ...rxx, sizeBytes: rxx.sizeBytes + 2 };
    await expect(collect(buildPackageStream(packageInput([wrong])).stream)).rejects.toThrow(PackageIntegrityError);
    await expect(collect(buildPackageStream(packageInput([wrong])).stream)).rejects.toThrow(
      `${rxx.storageKey} holds ${rxx.sizeBytes} bytes, the version lists ${rxx.sizeBytes + 2} for data/rxx_1p8K.csv`,
    );
  });
});

describe('a client that cancels mid-download', () => {
  const big = [fileWithBytes('sweep-a.bin', randomBytes(24 * MiB), `${prefix}big-a`), fileWithBytes('sweep-b.bin', randomBytes(24 * MiB), `${prefix}big-b`)];
  beforeAll(async () => {
    for (const f of big) await put(f);
  });

  it('destroys the storage body and its socket, reads no more and opens no further object', async () => {
    const opened: { key: string; body: Readable; socket: Socket }[] = [];
    const pkg = buildPackageStream(packageInput(big), {
      onObjectOpened: (key, body) => opened.push({ key, body, socket: (body as IncomingMessage).socket }),
    });
    const reader = pkg.stream.getReader();
    let received = 0;
    while (received < 2 * MiB || opened.length === 0) {
      const { value, done } = await reader.read();
      if (done) throw new Error('the package ended before the test could cancel it');
      received += value.length;
    }
    await reader.cancel();
    expect(opened.map((o) => o.key)).toEqual([`${prefix}big-a`]);
    const [{ body, socket }] = opened as [(typeof opened)[number]];
    expect(body.destroyed).toBe(true);
    expect(socket.destroyed).toBe(true);
    const readAtCancel = socket.bytesRead;
    // Pull-based: storage was read only a little ahead of the client (buffers, not the whole 24 MiB object).
    expect(readAtCancel).toBeLessThan(received + 8 * MiB);
    await new Promise((r) => setTimeout(r, 400));
    expect(socket.bytesRead).toBe(readAtCancel);
    expect(opened).toHaveLength(1);
  });
});
