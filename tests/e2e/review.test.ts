// A referee's journey in Chromium against the build `npm test` serves (its worker analyses uploads). The demo author
// deposits a small draft in her group through the API, finds it among her drafts and creates an anonymous reviewer
// link; a fresh browser context opens the link, sees the confidential band and the curves, and downloads the package,
// which lib/bagit's verifier accepts and which holds no creator, affiliation or group name.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import demo from '@/db/seeds/demo-accounts.json';
import { verifyBag } from '@/lib/bagit/verify-bag';
import meta from '@/tests/fixtures/transport/cu-wire-rt.meta.json';
import { baseUrl, browserForFile } from '@/tests/support/e2e';
import { HttpSession } from '@/tests/support/http-session';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!; // member of larkspur-cryogenic
const GROUP = { slug: 'larkspur-cryogenic', name: 'Larkspur Cryogenic Lab', institution: 'Northfell Institute of Technology' };
// cu-wire-rt.csv names the lab in its first line; the reviewer's copy hides the group, so this file must not carry it.
const CSV = readFileSync(path.resolve(import.meta.dirname, '../fixtures/transport/cu-wire-rt.csv'), 'utf8')
  .replace('# Larkspur Cryogenic Lab - four-wire R(T) on cooling', '# Four-wire R(T) on cooling');
const FILE = 'cu-wire-review.csv';
/** Names the anonymous copy must never show: the record's creator, her ORCID iD and affiliation, the author, the group. */
const NAMES = ['Imogen Vale', 'Imogen', meta.creators[0]!.orcid, 'Ada Penhallow', 'Penhallow', GROUP.name, GROUP.institution];

const browser = browserForFile();
const scratch = mkdtempSync(path.join(tmpdir(), 'ohm-e2e-review-'));

afterAll(() => {
  rmSync(scratch, { recursive: true, force: true });
});

async function json<T>(response: Response, status: number): Promise<T> {
  const text = await response.text();
  if (response.status !== status) throw new Error(`expected ${status}, got ${response.status}: ${text}`);
  return JSON.parse(text) as T;
}

function send(http: HttpSession, method: string, url: string, body: unknown): Promise<Response> {
  return http.fetch(url, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

/** A complete draft in the author's group with one analysed file; its version id as /api/v1/drafts lists it. */
async function depositDraft(http: HttpSession): Promise<string> {
  const title = `E2E review copy: ρ(T) of an annealed copper wire ${Date.now()}`;
  const created = await json<{ versionId: string }>(await send(http, 'POST', '/api/v1/datasets', { group: GROUP.slug, title }), 201);
  const record = { ...meta, title, description: 'Four-wire resistance of an annealed copper wire on cooling from 300 K to 2 K.' };
  expect(await json(await send(http, 'PUT', `/api/v1/versions/${created.versionId}/metadata`, record), 200)).toMatchObject({ saved: true, complete: true });

  const bytes = Buffer.from(CSV, 'utf8');
  const begin = await json<{ fileId: string; partSizeBytes: number; parts: { partNumber: number; url: string }[] }>(
    await send(http, 'POST', `/api/v1/versions/${created.versionId}/uploads`, {
      name: FILE, sizeBytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex'), mediaType: 'text/csv',
    }),
    201,
  );
  const parts = [];
  for (const { partNumber, url } of begin.parts) {
    const slice = bytes.subarray((partNumber - 1) * begin.partSizeBytes, partNumber * begin.partSizeBytes);
    const put = await fetch(url, { method: 'PUT', body: new Uint8Array(slice) });
    expect(put.status).toBe(200);
    parts.push({ partNumber, etag: put.headers.get('etag') ?? '' });
  }
  await json(await send(http, 'POST', `/api/v1/uploads/${begin.fileId}/complete`, { parts }), 200);
  await expect.poll(async () => {
    const view = await json<{ files: { id: string; analysisState: string }[] }>(await http.fetch(`/api/v1/versions/${created.versionId}`), 200);
    return view.files.find((f) => f.id === begin.fileId)?.analysisState;
  }, { timeout: 60_000, interval: 500 }).toBe('done');

  const drafts = await json<{ drafts: { versionId: string; groupSlug: string; fileCount: number }[] }>(await http.fetch('/api/v1/drafts'), 200);
  const listed = drafts.drafts.find((d) => d.versionId === created.versionId);
  expect(listed).toMatchObject({ groupSlug: GROUP.slug, fileCount: 1 });
  return listed!.versionId;
}

/** Every entry of a zip as text, for a search over names. */
async function zipTexts(file: string): Promise<{ name: string; text: string }[]> {
  const zip = await yauzl.openPromise(file, { autoClose: false });
  const out: { name: string; text: string }[] = [];
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const c of await zip.openReadStreamPromise(entry)) chunks.push(c as Buffer);
    out.push({ name: entry.fileName, text: Buffer.concat(chunks).toString('utf8') });
  }
  zip.close();
  return out;
}

describe('a referee with an anonymous review link', () => {
  it('opens the link without an account, sees the band and the curves, and downloads a verifiable package without names', async () => {
    const http = new HttpSession(baseUrl);
    expect((await http.signInWithPassword(author.email, demo.password)).status).toBe(200);
    const versionId = await depositDraft(http);
    const created = await json<{ link: { id: string }; token: string; url: string }>(
      await send(http, 'POST', `/api/v1/versions/${versionId}/reviewer-links`, { label: 'E2E referee 1', anonymous: true }), 201,
    );
    const reviewPath = new URL(created.url).pathname;
    expect(reviewPath).toBe(`/review/${created.token}`);

    const context = await browser().newContext({ acceptDownloads: true, viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const response = await page.goto(`${baseUrl}${reviewPath}`);
    expect(response?.status()).toBe(200);
    const band = page.getByRole('note', { name: 'Confidential review copy' });
    await band.waitFor();
    expect(await band.innerText()).toContain('Confidential review copy — do not share');
    expect(await band.innerText()).toContain('Authors, group and affiliations are hidden in this copy.');
    await page.locator('#curves canvas').first().waitFor({ timeout: 30_000 });
    const html = await page.content();
    expect(NAMES.filter((n) => html.includes(n))).toEqual([]);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download the package (zip)' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^ohmstead-ohm\.[0-9a-z-]+\.zip$/);
    const zip = path.join(scratch, download.suggestedFilename());
    await download.saveAs(zip);
    expect(await download.failure()).toBeNull();
    const report = await verifyBag(zip);
    expect(report.problems).toEqual([]);
    expect(report).toMatchObject({ valid: true, payloadFiles: 1, payloadBytes: Buffer.byteLength(CSV) });
    const entries = await zipTexts(zip);
    expect(entries.find((e) => e.name.endsWith(`/data/${FILE}`))?.text).toBe(CSV);
    expect(entries.find((e) => e.name.endsWith('/README.md'))?.text).toContain('**Confidential review copy.**');
    const leaks = entries.flatMap((e) => NAMES.filter((n) => e.text.includes(n)).map((n) => `${e.name}: ${n}`));
    expect(leaks).toEqual([]);
    await context.close();

    // Revoked, the same address shows why it stopped working, and the package route refuses with 403.
    await json(await http.fetch(`/api/v1/reviewer-links/${created.link.id}`, { method: 'DELETE' }), 200);
    const after = await browser().newPage();
    await after.goto(`${baseUrl}${reviewPath}`);
    await after.getByRole('heading', { name: 'Review link revoked' }).waitFor();
    expect((await fetch(`${baseUrl}${reviewPath}/package`)).status).toBe(403);
    await after.close();
  });
});
