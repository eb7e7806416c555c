// RFC 8493 §2.1.3: in manifest paths LF, CR, CRLF and "%" (and only those) are percent-encoded per RFC 3986.
import { afterAll, describe, expect, it } from 'vitest';
import { decodeBagPath, encodeBagPath, hasBarePercent, unsafeBagPathReason } from '@/lib/bagit/bag-paths';
import { verifyBag } from '@/lib/bagit/verify-bag';
import { digest, removeScratch, writeBag } from './make-bag';

afterAll(removeScratch);

describe('encodeBagPath / decodeBagPath', () => {
  it.each([
    ['data/plain name.csv', 'data/plain name.csv'],
    ['data/100%.csv', 'data/100%25.csv'],
    ['data/line\nbreak.txt', 'data/line%0Abreak.txt'],
    ['data/carriage\rreturn.txt', 'data/carriage%0Dreturn.txt'],
    ['data/crlf\r\n.txt', 'data/crlf%0D%0A.txt'],
    ['data/already%25encoded', 'data/already%2525encoded'],
    ['data/ρ(T) µΩ·cm.dat', 'data/ρ(T) µΩ·cm.dat'],
  ])('%j ↔ %j', (raw, encoded) => {
    expect(encodeBagPath(raw)).toBe(encoded);
    expect(decodeBagPath(encoded)).toBe(raw);
  });

  it('decodes lower-case hex too, and leaves every other %XX as written', () => {
    expect(decodeBagPath('data/a%0ab%0dc%25d')).toBe('data/a\nb\rc%d');
    expect(decodeBagPath('data/a%20b%2Fc')).toBe('data/a%20b%2Fc');
  });

  it('flags a "%" that is not %0A, %0D or %25', () => {
    expect(hasBarePercent('data/a%25b')).toBe(false);
    expect(hasBarePercent('data/a%20b')).toBe(true);
    expect(hasBarePercent('data/50%')).toBe(true);
  });
});

describe('unsafeBagPathReason', () => {
  it.each([
    ['data/x', undefined],
    ['data/sub/x', undefined],
    ['/etc/passwd', 'is absolute'],
    ['C:\\bag\\x', 'is absolute'],
    ['data/../../outside', 'escapes the bag with ".."'],
    ['data/./x', 'contains a "." segment'],
    ['data//x', 'contains an empty segment ("//" or a trailing "/")'],
  ])('%j → %j', (p, reason) => expect(unsafeBagPathReason(p)).toBe(reason));
});

describe('bags whose file names need encoding', () => {
  const payload = { '100%.csv': 'T,R\n1,2\n', 'two\nlines.txt': 'lf', 'cr\rname.txt': 'cr', 'both\r\n.txt': 'crlf' };

  it('verifies when the manifest percent-encodes CR, LF and %', async () => {
    const report = await verifyBag(writeBag({ payload, algorithms: ['sha256', 'md5'] }));
    expect(report.problems).toEqual([]);
    expect(report).toMatchObject({ valid: true, payloadFiles: 4, algorithms: ['md5', 'sha256'] });
  });

  it('rejects a manifest that writes "%" literally where the file is named "100%25.csv"', async () => {
    const content = 'x';
    const bag = writeBag({ payload: { '100%25.csv': content }, manifestText: { sha256: `${digest('sha256', content)}  data/100%25.csv\n` } });
    const report = await verifyBag(bag);
    // "data/100%25.csv" decodes to "data/100%.csv", which is not there; the real file is then unlisted.
    expect(report.problems).toEqual([
      'manifest-sha256.txt: lists data/100%.csv, which is not in the bag',
      'manifest-sha256.txt: does not list the payload file data/100%25.csv',
    ]);
  });
});
