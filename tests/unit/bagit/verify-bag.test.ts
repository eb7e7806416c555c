// The verifier on hand-written bags: each case breaks one RFC 8493 rule and names the expected problem line.
import { execFile } from 'node:child_process';
import { appendFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { verifyBag } from '@/lib/bagit/verify-bag';
import { digest, removeScratch, writeBag, writeRawZip } from './make-bag';

afterAll(removeScratch);

const RUN = 'T (K),R (Ohm)\n300,12.5\n';
const ok = { payload: { 'run.csv': RUN, 'sub/notes.txt': 'cooled slowly\n' } };

describe('verifyBag on directories', () => {
  it('accepts a well-formed bag and counts its payload (23 + 14 bytes, 2 files)', async () => {
    const report = await verifyBag(writeBag({ ...ok, bagInfo: 'Payload-Oxum: 37.2\nBagging-Date: 2026-12-02\n' }));
    expect(report).toEqual({ valid: true, problems: [], warnings: [], payloadFiles: 2, payloadBytes: 37, algorithms: ['sha256'] });
  });

  it('names a tampered payload byte with both digests', async () => {
    const bag = writeBag(ok);
    writeFileSync(path.join(bag, 'data/run.csv'), RUN.replace('12.5', '12.6'));
    const report = await verifyBag(bag);
    expect(report.problems).toEqual([
      `data/run.csv: sha256 is ${digest('sha256', RUN.replace('12.5', '12.6'))}, the manifest says ${digest('sha256', RUN)}`,
    ]);
  });

  it('checks Payload-Oxum bytes and file count', async () => {
    const report = await verifyBag(writeBag({ ...ok, bagInfo: 'Payload-Oxum: 39.3\n' }));
    expect(report.problems).toEqual([
      'bag-info.txt: Payload-Oxum declares 39 payload bytes, the payload has 37',
      'bag-info.txt: Payload-Oxum declares 3 payload files, the payload has 2',
    ]);
    const malformed = await verifyBag(writeBag({ ...ok, bagInfo: 'Payload-Oxum: 37\n' }));
    expect(malformed.problems).toEqual(['bag-info.txt: Payload-Oxum "37" is not of the form OctetCount.StreamCount']);
  });

  it('rejects a missing payload file, an unlisted one and a path escaping the bag', async () => {
    const bag = writeBag({
      payload: { 'run.csv': RUN },
      manifestText: { sha256: `${digest('sha256', RUN)}  data/run.csv\n${digest('sha256', 'x')}  data/gone.csv\n${digest('sha256', 'x')}  data/../../etc/passwd\n` },
    });
    writeFileSync(path.join(bag, 'data/extra.csv'), 'x');
    const report = await verifyBag(bag);
    expect(report.problems).toEqual([
      'manifest-sha256.txt: lists data/gone.csv, which is not in the bag',
      'manifest-sha256.txt: the path data/../../etc/passwd escapes the bag with ".."',
      'manifest-sha256.txt: does not list the payload file data/extra.csv',
    ]);
  });

  it('rejects a manifest listing a tag file as payload, and a tag manifest listing payload', async () => {
    const bag = writeBag({ payload: { 'run.csv': RUN }, manifestText: { sha256: `${digest('sha256', RUN)}  data/run.csv\n${digest('sha256', 'x')}  bagit.txt\n` } });
    appendFileSync(path.join(bag, 'tagmanifest-sha256.txt'), `${digest('sha256', RUN)}  data/run.csv\n`);
    const report = await verifyBag(bag);
    expect(report.problems).toContain('manifest-sha256.txt: lists bagit.txt, which is outside the payload directory data/');
    expect(report.problems).toContain('tagmanifest-sha256.txt: lists the payload file data/run.csv; tag manifests list tag files only');
  });

  it('checks tag manifest digests (a changed bag-info.txt)', async () => {
    const bag = writeBag({ ...ok, bagInfo: 'Source-Organization: Larkspur Cryogenic Lab\n' });
    writeFileSync(path.join(bag, 'bag-info.txt'), 'Source-Organization: Tidewater Thin Films Group\n');
    const report = await verifyBag(bag);
    expect(report.problems).toEqual([
      `bag-info.txt: sha256 is ${digest('sha256', 'Source-Organization: Tidewater Thin Films Group\n')}, the manifest says ${digest('sha256', 'Source-Organization: Larkspur Cryogenic Lab\n')}`,
    ]);
  });

  it('requires bagit.txt, data/ and a payload manifest; refuses a BOM and unknown algorithms', async () => {
    const bag = writeBag({ ...ok, algorithms: ['sha256'] });
    rmSync(path.join(bag, 'bagit.txt'));
    expect((await verifyBag(bag)).problems).toEqual(['bagit.txt: missing, so this is not a bag']);

    const bom = writeBag({ ...ok, tagManifest: false });
    writeFileSync(path.join(bom, 'bagit.txt'), '\uFEFFBagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n');
    expect((await verifyBag(bom)).problems).toEqual(['bagit.txt: starts with a byte-order mark, which RFC 8493 §2.1.1 forbids']);

    const empty = writeBag({ payload: {}, algorithms: [], tagManifest: false });
    rmSync(path.join(empty, 'data'), { recursive: true });
    writeFileSync(path.join(empty, 'manifest-crc32.txt'), '');
    expect((await verifyBag(empty)).problems).toEqual([
      'data/: the payload directory is missing',
      'manifest-crc32.txt: the algorithm "crc32" is not supported (md5, sha1, sha224, sha256, sha384, sha512)',
      'manifest-<algorithm>.txt: the bag has no payload manifest',
    ]);
  });

  it('needs every file in every payload manifest (sha256 and sha512 here)', async () => {
    const bag = writeBag({ ...ok, algorithms: ['sha256', 'sha512'], manifestText: { sha512: `${digest('sha512', RUN)}  data/run.csv\n` } });
    expect((await verifyBag(bag)).problems).toEqual(['manifest-sha512.txt: does not list the payload file data/sub/notes.txt']);
  });

  it('refuses a symbolic link that leads outside the bag', async () => {
    const bag = writeBag(ok);
    symlinkSync('/etc/hostname', path.join(bag, 'data/link'));
    expect((await verifyBag(bag)).problems).toContain('data/link: a symbolic link that leads outside the bag');
  });
});

describe('fetch.txt (RFC 8493 §2.2.3)', () => {
  const listed = `${digest('sha256', RUN)}  data/run.csv\n${digest('sha256', 'remote')}  data/remote.csv\n`;

  it('is incomplete, so invalid, while a listed file has not been fetched', async () => {
    const bag = writeBag({ payload: { 'run.csv': RUN }, manifestText: { sha256: listed }, extraTagFiles: { 'fetch.txt': 'https://data.example/remote.csv 6 data/remote.csv\n' } });
    expect((await verifyBag(bag)).problems).toEqual([
      'data/remote.csv: listed in fetch.txt but not fetched yet (this verifier does not download; fetch it, then verify again)',
    ]);
  });

  it('is valid once the file is present with the declared length and digest', async () => {
    const bag = writeBag({ payload: { 'run.csv': RUN, 'remote.csv': 'remote' }, manifestText: { sha256: listed }, extraTagFiles: { 'fetch.txt': 'https://data.example/remote.csv 6 data/remote.csv\n' } });
    expect((await verifyBag(bag)).problems).toEqual([]);
  });

  it('rejects relative URLs, tag-file targets, wrong lengths and files missing from the manifest', async () => {
    const fetch = 'remote.csv - data/remote.csv\nhttps://data.example/x 5 bag-info.txt\nhttps://data.example/r 7 data/run.csv\n';
    const bag = writeBag({ payload: { 'run.csv': RUN, 'remote.csv': 'remote' }, manifestText: { sha256: listed }, extraTagFiles: { 'fetch.txt': fetch } });
    expect((await verifyBag(bag)).problems).toEqual([
      'fetch.txt: line 1: "remote.csv" is not an absolute URL',
      'fetch.txt: lists bag-info.txt, which is not a payload file',
      'fetch.txt: bag-info.txt is not listed in manifest-sha256.txt',
      'fetch.txt: data/run.csv declares 7 bytes, the file has 23',
    ]);
  });
});

describe('verifyBag on zips', () => {
  const bagit = 'BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n';

  it('accepts a zip whose single top-level folder is the bag', async () => {
    const zip = writeRawZip([
      { name: 'pkg/bagit.txt', data: bagit },
      { name: 'pkg/manifest-md5.txt', data: `${digest('md5', RUN)}  data/run.csv\n` },
      { name: 'pkg/data/run.csv', data: RUN },
    ]);
    expect(await verifyBag(zip)).toMatchObject({ valid: true, problems: [], payloadFiles: 1, algorithms: ['md5'] });
  });

  it.each([
    ['../evil.txt', 'invalid relative path: ../evil.txt'],
    ['/abs/evil.txt', 'absolute path: /abs/evil.txt'],
    ['data\\evil.txt', 'invalid characters in fileName: data\\evil.txt'],
  ])('refuses the entry %j without writing outside the temp dir', async (name, reason) => {
    const zip = writeRawZip([{ name: 'bagit.txt', data: bagit }, { name, data: 'x' }]);
    const report = await verifyBag(zip);
    expect(report.valid).toBe(false);
    expect(report.problems).toEqual([`bag.zip: cannot be unpacked safely: ${reason}`]);
  });

  it('refuses symbolic-link entries', async () => {
    const zip = writeRawZip([{ name: 'bagit.txt', data: bagit }, { name: 'data/link', data: '/etc/passwd', mode: 0o120777 }]);
    expect((await verifyBag(zip)).problems).toEqual(['bag.zip: cannot be unpacked safely: zip entry "data/link" is a symbolic link; a bag holds regular files only']);
  });
});

describe('npm run verify-bag (scripts/verify-bag.ts)', () => {
  const run = async (args: string[]) => {
    try {
      const { stdout, stderr } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/verify-bag.ts', ...args], { cwd: path.resolve(import.meta.dirname, '../../..') });
      return { code: 0, stdout, stderr };
    } catch (error) {
      const e = error as { code: number; stdout: string; stderr: string };
      return { code: e.code, stdout: e.stdout, stderr: e.stderr };
    }
  };

  it('exits 0 on a valid bag, 1 with one problem a line on an invalid one, 2 on bad usage', async () => {
    const good = writeBag(ok);
    expect(await run([good])).toMatchObject({ code: 0, stdout: `${good}: valid BagIt bag, 2 payload files, 37 bytes, checked with sha256\n` });
    const bad = writeBag({ ...ok, bagInfo: 'Payload-Oxum: 39.3\n' });
    const invalid = await run([bad]);
    expect(invalid.code).toBe(1);
    expect(invalid.stdout.split('\n').filter(Boolean)).toEqual([
      'bag-info.txt: Payload-Oxum declares 39 payload bytes, the payload has 37',
      'bag-info.txt: Payload-Oxum declares 3 payload files, the payload has 2',
    ]);
    expect((await run([])).code).toBe(2);
    expect((await run([path.join(tmpdir(), `ohm-absent-${process.pid}-${Date.now()}.zip`)])).code).toBe(2);
    const zip = writeRawZip([
      { name: 'bagit.txt', data: 'BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n' },
      { name: 'manifest-sha256.txt', data: `${digest('sha256', RUN)}  data/run.csv\n` },
      { name: 'data/run.csv', data: RUN },
    ]);
    expect(await run([zip])).toMatchObject({ code: 0, stdout: `${zip}: valid BagIt bag, 1 payload file, 23 bytes, checked with sha256\n` });
  });
});
