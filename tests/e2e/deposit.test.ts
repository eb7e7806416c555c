// The author's deposit journey in Chromium against the build `npm test` serves (with its worker analysing files):
// sign in, start a dataset, upload a file whose unit the detector gets wrong, fix it, fill the geometry, see ρ.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import demo from '@/db/seeds/demo-accounts.json';
import { accessibilityProblems, baseUrl, browserForFile } from '@/tests/support/e2e';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!; // member of larkspur-cryogenic
const FILE = 'cu-wire-caps.csv';
const browser = browserForFile();
let upload: string;

beforeAll(() => {
  // tests/fixtures/transport/cu-wire-rt.csv with its resistance unit in capitals: 'MOHM' reads as mega-ohm (and the
  // parser says it may mean milli), so the author has a real unit to fix.
  const csv = readFileSync(path.resolve(import.meta.dirname, '../fixtures/transport/cu-wire-rt.csv'), 'utf8');
  upload = path.join(mkdtempSync(path.join(tmpdir(), 'ohm-e2e-')), FILE);
  writeFileSync(upload, csv.replace('R [mOhm]', 'R (MOHM)'));
});

const derivedOf = (page: Page) => page.locator(`section[aria-label="Derived quantities and flags of ${FILE}"]`);

describe('depositing in Chromium', () => {
  it('the demo author uploads a file, fixes a unit, fills the geometry and sees ρ; a reload keeps the draft', async () => {
    const page = await browser().newPage({ viewport: { width: 1280, height: 900 } });

    // Authoring needs a session: the deposit page sends visitors to sign in and back again.
    await page.goto(`${baseUrl}/deposit`);
    await page.waitForURL(/\/sign-in\?callbackUrl=%2Fdeposit$/);
    await page.getByLabel('E-mail address', { exact: true }).first().fill(author.email);
    await page.getByLabel('Password', { exact: true }).fill(demo.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${baseUrl}/deposit`);
    expect(await accessibilityProblems(page)).toEqual([]);

    const title = `Cu wire R(T), unit fixed in the browser ${Date.now()}`;
    await page.getByLabel('Group', { exact: true }).selectOption('larkspur-cryogenic');
    await page.getByLabel('Title', { exact: true }).fill(title);
    await page.getByRole('button', { name: 'Start the dataset' }).click();
    await page.waitForURL(/\/deposit\/[0-9a-f-]{36}$/);
    const draftUrl = page.url();
    expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe(title);

    // Upload through the file input; the file's own progress bar runs to "ready" (stored, verified and analysed).
    await page.locator('input[type=file]').first().setInputFiles(upload);
    const bar = page.getByRole('progressbar', { name: `Progress of ${FILE}` });
    await expect.poll(() => bar.getAttribute('aria-valuetext'), { timeout: 60_000, interval: 500 }).toBe('ready');
    expect(await bar.getAttribute('aria-valuenow')).toBe('100');

    // The server's analysis read MOHM as MΩ and says why; the author picks mΩ and the plot redraws at once.
    await page.getByRole('heading', { name: FILE, exact: true }).first().waitFor({ timeout: 30_000 });
    const unit = page.getByLabel('Unit of column R (MOHM)');
    expect(await unit.inputValue()).toBe('MOhm');
    expect(await page.locator('#columns').innerText()).toContain("'M' was taken as mega");
    await unit.selectOption('mOhm');
    await expect.poll(() => page.locator('#preview figcaption').innerText()).toContain('R from 0.255 to 44 mΩ');

    // Geometry of the fixture's wire (cu-wire-rt.meta.json): 20 mm between voltage contacts, 0.1 mm diameter.
    await page.getByLabel('Length between voltage contacts', { exact: true }).fill('20');
    await page.getByLabel('Length between voltage contacts: length unit').selectOption('mm');
    await page.getByLabel('Diameter', { exact: true }).fill('0.1');
    await page.getByLabel('Diameter: length unit').selectOption('mm');

    // ρ(300 K) = R·A/L = 43.959 mΩ · π(0.05 mm)² / 20 mm = 1.726×10⁻⁸ Ω·m = 1.73 µΩ·cm (definition of resistivity).
    await expect.poll(() => derivedOf(page).innerText(), { timeout: 60_000, interval: 1000 }).toContain('1.73 µΩ·cm');
    expect(await derivedOf(page).innerText()).toContain('1.73×10⁻⁸ Ω·m');
    await expect.poll(() => page.getByTestId('save-status').innerText()).toMatch(/Saved at \d\d:\d\d:\d\d \(.+\)/);
    expect(await accessibilityProblems(page)).toEqual([]);

    // A reload shows the saved draft: the fixed unit, the geometry and the computed resistivity.
    await page.reload();
    await page.getByRole('heading', { name: FILE, exact: true }).first().waitFor({ timeout: 30_000 });
    expect(await page.getByLabel('Unit of column R (MOHM)').inputValue()).toBe('mOhm');
    expect(await page.getByLabel('Diameter', { exact: true }).inputValue()).toBe('0.1');
    expect(await page.getByLabel('Diameter: length unit').inputValue()).toBe('mm');
    await expect.poll(() => derivedOf(page).innerText(), { timeout: 30_000 }).toContain('1.73 µΩ·cm');

    // The draft is listed on the deposit page with its file.
    await page.goto(`${baseUrl}/deposit`);
    const entry = page.getByRole('listitem').filter({ hasText: title });
    expect(await entry.innerText()).toContain('1 file');
    expect(await entry.getByRole('link', { name: title, exact: true }).getAttribute('href')).toBe(new URL(draftUrl).pathname);
    await page.close();
  });

  it('an unknown draft shows the not-found page inside the authoring area', async () => {
    const page = await browser().newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail address', { exact: true }).first().fill(author.email);
    await page.getByLabel('Password', { exact: true }).fill(demo.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${baseUrl}/groups`);
    await page.goto(`${baseUrl}/deposit/00000000-0000-4000-8000-000000000000`);
    await page.getByRole('heading', { name: 'Draft not found' }).waitFor();
    expect(await page.locator('main').innerText()).toContain('belongs to a group you are not in');
    await page.close();
  });
});
