// Oracle: Library of Congress BagIt conformance suite, v1.0 (../shared/oracles/bagit-conformance, CC0).
// Its README: every bag under valid/ must pass validation, every bag under invalid/ must fail.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { verifyBag } from '@/lib/bagit/verify-bag';

const SUITE = path.resolve(import.meta.dirname, '../../../../shared/oracles/bagit-conformance/v1.0');
const bags = (kind: 'valid' | 'invalid') => readdirSync(path.join(SUITE, kind)).sort();

// Why each invalid bag fails: the reason its own data/README (or its name) gives. A bag added to the suite later
// must still fail; it just has no named reason here yet.
const REASON: Record<string, string> = {
  'bagit-with-invalid-whitespace': 'bagit.txt: line 1 must be "BagIt-Version: M.N", found "BagIt-Version : 1.0"',
  notAllManifestsListAllFiles: 'manifest-sha512.txt: does not list the payload file data/missingFromManifest.txt',
  'same-filename-listed-twice-with-different-hashes': 'manifest-sha256.txt: lists data/README twice with different digests',
  // The suite files this under invalid/ (its README calls acceptance with a warning tolerable); we follow the folder.
  'same-filename-listed-twice-with-the-same-hash': 'manifest-sha256.txt: lists data/README twice',
};

describe('BagIt conformance suite v1.0', () => {
  it('has bags in both folders', () => {
    expect(bags('valid').length).toBeGreaterThanOrEqual(1);
    expect(bags('invalid').length).toBeGreaterThanOrEqual(4);
  });

  it.each(bags('valid'))('accepts valid/%s with no problem', async (name) => {
    const report = await verifyBag(path.join(SUITE, 'valid', name));
    expect(report.problems).toEqual([]);
    expect(report.valid).toBe(true);
  });

  it.each(bags('invalid'))('rejects invalid/%s', async (name) => {
    const report = await verifyBag(path.join(SUITE, 'invalid', name));
    expect(report.valid).toBe(false);
    expect(report.problems.length).toBeGreaterThan(0);
    if (REASON[name]) expect(report.problems).toContain(REASON[name]);
  });

  it('reports the basic bag\'s payload: one file "hello\\n" of 6 bytes under sha512', async () => {
    const report = await verifyBag(path.join(SUITE, 'valid', 'basicBag'));
    expect(report).toMatchObject({ payloadFiles: 1, payloadBytes: 6, algorithms: ['sha512'], warnings: [] });
  });
});
