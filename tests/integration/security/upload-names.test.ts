// Hostile file names: through the real upload route (POST /api/v1/versions/:id/uploads) they are kept as display text
// only (storage keys are staging/<fileId>/), refused when no database or file system keeps them, and turned into safe,
// distinct zip entry paths and download names (APPNOTE 4.4.17: no drive letter, no leading "/", "/" separators).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST as beginUploadRoute } from '@/app/api/v1/versions/[versionId]/uploads/route';
import { db } from '@/lib/db';
import { contentDisposition } from '@/lib/downloads/content-disposition';
import { sanitiseEntryNames } from '@/lib/packages/sanitise-entry-names';
import { resetLimit } from '@/lib/rate-limit/rate-limit';
import { API_PER_TOKEN } from '@/lib/tokens/api-rate-limit';
import { createToken } from '@/lib/tokens/create-token';
import { makeTokenLab, removeTokenLab, type TokenLab } from '../tokens/fixtures';

const HOSTILE = [
  '../../etc/passwd',
  '/etc/shadow',
  'C:\\Windows\\System32\\drivers\\etc\\hosts',
  '..\\..\\boot.ini',
  '<script>alert(1)</script>.csv',
  '"><img src=x onerror=alert(1)>.dat',
  'run.csv\r\nContent-Type: text/html',
  'CON',
  'aux.csv',
  'run.csv',
  'RUN.csv',
  ' .. / .. / x.csv',
  'evil\u202Evsc.exe',
  'a:b|c?d*e.csv',
];
const SHA = 'a'.repeat(64);

let lab: TokenLab;
let secret: string;
let tokenId: string;

beforeAll(async () => {
  lab = await makeTokenLab();
  const created = await createToken({ id: lab.member.id, via: 'session' }, { name: 'upload-name probe', scopes: ['read', 'deposit'] });
  secret = created.token;
  tokenId = created.id;
});

afterAll(async () => {
  await resetLimit(API_PER_TOKEN, tokenId);
  await removeTokenLab(lab);
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

function begin(name: string): Promise<Response> {
  const req = new Request(`http://localhost/api/v1/versions/${lab.draftVersionId}/uploads`, {
    method: 'POST',
    headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json', 'x-forwarded-for': '203.0.113.42' },
    body: JSON.stringify({ name, sizeBytes: 12, sha256: SHA }),
  });
  return beginUploadRoute(req, { params: Promise.resolve({ versionId: lab.draftVersionId }) });
}

describe('upload names through the upload route', () => {
  it.each(HOSTILE)('%j is stored as display text under a storage key made of the file id only', async (name) => {
    const res = await begin(name);
    expect(res.status).toBe(201);
    const { fileId } = (await res.json()) as { fileId: string };
    const row = await db()('files').where({ id: fileId }).first('name', 'staging_key');
    expect(row).toEqual({ name: name.trim(), staging_key: `staging/${fileId}/` });
  });

  it.each([
    ['a NUL character', 'run\u0000.csv', 'NUL character'],
    ['a lone surrogate', 'run\uD800.csv', 'not valid Unicode'],
    ['256 characters', `${'r'.repeat(252)}.csv`, 'longer than 255'],
    ['only spaces', '   ', 'empty'],
  ])('refuses a name with %s (422) and stores nothing', async (_what, name, message) => {
    const res = await begin(name);
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toContain(message);
  });
});

describe('zip entry names and download names', () => {
  const paths = sanitiseEntryNames(HOSTILE);

  it('never leave data/, never carry a drive letter, a backslash, a reserved or a control character', () => {
    for (const p of paths) {
      expect(p.split('/')).not.toContain('..');
      expect(p.split('/')).not.toContain('.');
      expect(p).not.toMatch(/^\/|\\|[<>:"|?*\u0000-\u001F\u007F]/);
      for (const segment of p.split('/')) expect(segment).not.toMatch(/^(con|prn|aux|nul|com\d|lpt\d)(\..*)?$/i);
    }
  });

  it('are distinct ignoring case, with the expected values for the classic traversals', () => {
    expect(new Set(paths.map((p) => p.toLowerCase())).size).toBe(HOSTILE.length);
    // Check values worked by hand from the rules in lib/packages/sanitise-entry-names.ts.
    expect(paths.slice(0, 4)).toEqual(['etc/passwd', 'etc/shadow', 'C_/Windows/System32/drivers/etc/hosts', 'boot.ini']);
    expect(paths[7]).toBe('_CON');
    expect(paths[8]).toBe('_aux.csv');
    expect(paths.slice(9, 11)).toEqual(['run.csv', 'RUN-2.csv']);
    expect(paths[11]).toBe('x.csv');
  });

  it('a CR LF in a name cannot split the Content-Disposition header or break out of its quotes', () => {
    const header = contentDisposition('run.csv\r\nContent-Type: text/html";x=".csv');
    expect(header).not.toMatch(/[\r\n]/);
    // CR, LF and '"' become "_" (sanitiseEntryName); ';' is harmless inside the quotes and %3B in filename*.
    expect(header).toBe(`attachment; filename="run.csv__Content-Type_ text_html_;x=_.csv"; filename*=UTF-8''run.csv__Content-Type_%20text_html_%3Bx%3D_.csv`);
  });
});
