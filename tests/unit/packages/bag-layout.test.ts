// The package's BagIt layout from planBag, checked line by line and then by the verifier on a directory written from it.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { verifyBagDirectory } from '@/lib/bagit/verify-bag';
import { defaultBagName, planBag } from '@/lib/packages/bag-layout';
import type { BagPlan } from '@/lib/packages/types';
import { validateWithXsd } from '../datacite/xsd';
import { fileWithBytes, packageInput, RXX_CSV, RXY_CSV, sha256Hex, type FileWithBytes } from './fixtures';

const tag = (plan: BagPlan, p: string) => plan.tagFiles.find((t) => t.path === p)!.content.toString('utf8');

const scratch = mkdtempSync(path.join(tmpdir(), 'ohm-plan-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** The bag as a directory: tag files from the plan, payload bytes from the test's files. */
function writePlan(plan: BagPlan, files: FileWithBytes[]): string {
  const root = mkdtempSync(path.join(scratch, 'bag-'));
  const write = (rel: string, data: Buffer) => {
    mkdirSync(path.dirname(path.join(root, rel)), { recursive: true });
    writeFileSync(path.join(root, rel), data);
  };
  for (const t of plan.tagFiles) write(t.path, t.content);
  for (const p of plan.payload) write(p.path, files.find((f) => f.storageKey === p.file.storageKey)!.bytes);
  return root;
}

describe('planBag', () => {
  const files = [fileWithBytes('rxx_1p8K.csv', RXX_CSV, 'k/1'), fileWithBytes('100%/rxy.csv', RXY_CSV, 'k/2'), fileWithBytes('Rxx_1p8K.csv', 'dup', 'k/3')];
  const plan = planBag(packageInput(files));

  it('orders tag files bagit.txt first and tagmanifest last, with every required tag file', () => {
    expect(plan.tagFiles.map((t) => t.path)).toEqual([
      'bagit.txt',
      'bag-info.txt',
      'manifest-sha256.txt',
      'README.md',
      'CITATION.cff',
      'citation.bib',
      'metadata/ohmstead-record.json',
      'metadata/datacite.xml',
      'tagmanifest-sha256.txt',
    ]);
    expect(plan.bagName).toBe('ohmstead-ohm.k7p2-v2');
    expect(tag(plan, 'bagit.txt')).toBe('BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n');
  });

  it('writes bag-info.txt (RFC 8493 §2.2.2) with the DOI, date, Payload-Oxum and agent', () => {
    const payloadBytes = RXX_CSV.length + RXY_CSV.length + 3;
    expect(plan.payloadBytes).toBe(payloadBytes);
    const lines = tag(plan, 'bag-info.txt').split('\n');
    expect(lines.slice(0, 5)).toEqual([
      'Source-Organization: Cobalt Ridge Magnetotransport Lab',
      'External-Identifier: https://doi.org/10.99999/ohm.k7p2-v2',
      'External-Description: Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K. Electrical transport dataset, version 2, 3 files.',
      'Bagging-Date: 2026-12-02',
      `Payload-Oxum: ${payloadBytes}.3`,
    ]);
    expect(lines[5]).toMatch(/^Bag-Size: \d+\.\d KiB$/);
    expect(lines.slice(6)).toEqual(['Bag-Software-Agent: Ohmstead', '']);
  });

  it('lists the database digests in manifest-sha256.txt, percent-encoding "%" and suffixing a case duplicate', () => {
    expect(tag(plan, 'manifest-sha256.txt')).toBe(
      `${sha256Hex(RXX_CSV)}  data/rxx_1p8K.csv\n${sha256Hex(RXY_CSV)}  data/100%25/rxy.csv\n${sha256Hex('dup')}  data/Rxx_1p8K-2.csv\n`,
    );
    expect(plan.payload.map((p) => p.path)).toEqual(['data/rxx_1p8K.csv', 'data/100%/rxy.csv', 'data/Rxx_1p8K-2.csv']);
  });

  it('hashes every other tag file into tagmanifest-sha256.txt', () => {
    const expected = plan.tagFiles.slice(0, -1).map((t) => `${sha256Hex(t.content)}  ${t.path}\n`).join('');
    expect(tag(plan, 'tagmanifest-sha256.txt')).toBe(expected);
  });

  it('is a valid bag once the payload bytes sit beside it (verifier, RFC 8493)', async () => {
    const report = await verifyBagDirectory(writePlan(plan, files));
    expect(report).toMatchObject({ valid: true, problems: [], warnings: [], payloadFiles: 3, payloadBytes: plan.payloadBytes });
  });

  it('names renamed files in the README and the record', () => {
    expect(tag(plan, 'README.md')).toContain('- `Rxx_1p8K.csv` → `data/Rxx_1p8K-2.csv`');
    const record = JSON.parse(tag(plan, 'metadata/ohmstead-record.json'));
    expect(record.files[2]).toEqual({ path: 'data/Rxx_1p8K-2.csv', depositedName: 'Rxx_1p8K.csv', sizeBytes: 3, sha256: sha256Hex('dup'), mediaType: 'text/csv' });
  });

  it('writes a README with the columns and their units, and the DataCite text citation', () => {
    const readme = tag(plan, 'README.md');
    expect(readme).toContain('| Rxx | resistance | Ω | `Ohm` | measured (y) |');
    expect(readme).toContain('| B | magnetic field | T | `T` | independent (x) |');
    expect(readme).toContain(
      'Brackenridge, Odile; van der Holt, Casimir; Pemberton, Yusra (2026): Magnetoresistance of a Bi₂Se₃ flake from 1.8 K to 300 K. Version 2. Ohmstead. (Dataset). https://doi.org/10.99999/ohm.k7p2-v2',
    );
  });

  it('writes CITATION.cff 1.2.0 with each author split into family and given names', () => {
    const cff = tag(plan, 'CITATION.cff');
    expect(cff).toContain('cff-version: 1.2.0\nmessage: "If you use this dataset, please cite it as below."\ntype: dataset\n');
    expect(cff).toContain('  - family-names: "van der Holt"\n    given-names: "Casimir"\n    orcid: "https://orcid.org/0000-0000-1618-0334"\n');
    expect(cff).toContain('doi: "10.99999/ohm.k7p2-v2"\n');
    expect(cff).toContain('date-released: 2026-03-14\n');
    expect(tag(plan, 'citation.bib')).toContain('\tauthor = {Brackenridge, Odile and van der Holt, Casimir and Pemberton, Yusra},');
  });

  it('writes DataCite XML that the 4.7 XSD accepts', () => {
    const verdict = validateWithXsd(tag(plan, 'metadata/datacite.xml'));
    expect(verdict.messages).toMatch(/validates/);
    expect(verdict.ok).toBe(true);
  });

  it('claims no publication date for an unpublished version', () => {
    const draft = planBag(packageInput(files, { unpublished: true, reviewCopy: true }));
    expect(tag(draft, 'CITATION.cff')).not.toContain('date-released');
    expect(tag(draft, 'README.md')).toContain('Version 2, not yet published · DOI reserved: 10.99999/ohm.k7p2-v2');
    expect(tag(draft, 'README.md')).toContain('> **Confidential review copy.**');
  });

  it('refuses a digest that is not 64 lower-case hex digits', () => {
    expect(() => planBag(packageInput([{ ...files[0]!, sha256: 'ABC' }]))).toThrow('sha256 must be 64 lower-case hex digits');
  });

  it('derives a safe default bag name from the DOI suffix, and cleans a given one', () => {
    expect(defaultBagName('https://doi.org/10.99999/ohm.x7k2/p9q4 v1')).toBe('ohmstead-ohm.x7k2-p9q4-v1');
    expect(planBag(packageInput(files, { bagName: '../review/copy:1' })).bagName).toBe('review-copy_1');
  });
});
