// The search page in Chromium, as a visitor uses it: results update in place from /api/v1/search while the URL holds
// the search, Back and Forward restore earlier searches, and two labs' curves found through it go to Compare (log
// axis, CSV export). The expected titles and temperature spans come from the demo seed (db/seeds/demo-data): the
// copper film of Larkspur Cryogenic Lab is measured from 2 K, the ITO film of Tidewater Thin Films Group from 10 K.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { BG_FILM, blochGruneisenFilmDeposit } from '@/db/seeds/demo-data/bloch-gruneisen-film';
import { VDP_FILM, vanDerPauwDeposit } from '@/db/seeds/demo-data/van-der-pauw-film';
import { accessibilityProblems, baseUrl, browserForFile, watchCsp } from '@/tests/support/e2e';

const COPPER = blochGruneisenFilmDeposit();
const ITO = vanDerPauwDeposit();
// A band the copper film's sweep covers and the ITO film's does not: the ITO sweep starts at VDP_FILM.fromK = 10 K.
const T_FROM = (BG_FILM.fromK + VDP_FILM.fromK) / 2; // 6 K
const T_TO = 200;

const browser = browserForFile();
// axe-core checks the page below the site header, which is the shell's.
const A11Y_SCOPE = { exclude: ['body > header'] };

/** Opens a search address and waits until React has hydrated the search field (typing before that would be lost). */
async function openSearch(page: Page, path: string): Promise<void> {
  const response = await page.goto(`${baseUrl}${path}`);
  expect(response?.status(), path).toBe(200);
  await page.waitForFunction(() => {
    const input = document.getElementById('search-q');
    return input !== null && Object.keys(input).some((k) => k.startsWith('__reactProps'));
  });
}

const isSearchApi = (url: URL) => url.pathname === '/api/v1/search';
const search = (page: Page) => new URL(page.url()).searchParams;
const resultTitles = (page: Page) => page.locator('main article h3').allInnerTexts();
const heading = (page: Page) => page.locator('#results-heading');

/** Waits until the page shows the answer for its URL (not busy) and returns the card titles. */
async function settledTitles(page: Page): Promise<string[]> {
  await expect.poll(() => page.locator('section[aria-labelledby="results-heading"]').getAttribute('aria-busy')).toBe('false');
  return resultTitles(page);
}

describe('the search page in Chromium', () => {
  it('finds a demo material, filters by temperature through the URL, restores searches on Back and takes two labs to Compare', async () => {
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    const page = await context.newPage();
    const violations = await watchCsp(page);
    const apiCalls: string[] = [];
    page.on('request', (r) => {
      if (new URL(r.url()).pathname === '/api/v1/search') apiCalls.push(new URL(r.url()).search);
    });
    await openSearch(page, '/search');

    // A material by name: Enter puts the search in the URL, the copper film's card comes back with the word marked.
    const text = page.getByLabel('Search text');
    await text.fill('copper');
    await text.press('Enter');
    await expect.poll(() => search(page).get('q')).toBe('copper');
    await expect.poll(() => settledTitles(page)).toContain(COPPER.title);
    expect(await resultTitles(page)).not.toContain(ITO.title);
    expect(await page.locator('main article mark').first().innerText()).toMatch(/copper/i);
    expect(apiCalls.some((q) => new URLSearchParams(q).get('q') === 'copper')).toBe(true); // fetched by the page, not re-rendered

    // Both demo films were sputtered: a second search lists the two labs.
    await text.fill('sputtered film');
    await text.press('Enter');
    await expect.poll(() => search(page).get('q')).toBe('sputtered film');
    await expect.poll(async () => (await settledTitles(page)).filter((t) => t === COPPER.title || t === ITO.title).sort()).toEqual([COPPER.title, ITO.title].sort());
    const bothHeading = await heading(page).innerText();

    // Temperature band: the range fields reach the URL after typing pauses; only the copper film covers 6–200 K.
    await page.getByLabel('T from (K)').fill(String(T_FROM));
    await page.getByLabel('T to (K)').fill(String(T_TO));
    await expect.poll(() => [search(page).get('tMin'), search(page).get('tMax')]).toEqual([String(T_FROM), String(T_TO)]);
    expect(search(page).get('q')).toBe('sputtered film');
    await expect.poll(() => settledTitles(page)).not.toContain(ITO.title);
    expect(await resultTitles(page)).toContain(COPPER.title);
    expect(await heading(page).innerText()).not.toBe(bothHeading);
    expect(await page.getByLabel('T from (K)').inputValue()).toBe(String(T_FROM));

    // Back: the unfiltered search and its results, fields emptied; once more: the copper search; Forward again.
    await page.goBack();
    await expect.poll(() => search(page).get('tMin')).toBeNull();
    expect(search(page).get('q')).toBe('sputtered film');
    await expect.poll(() => settledTitles(page)).toContain(ITO.title);
    expect(await heading(page).innerText()).toBe(bothHeading);
    expect(await page.getByLabel('T from (K)').inputValue()).toBe('');
    expect(await text.inputValue()).toBe('sputtered film');
    await page.goBack();
    await expect.poll(() => search(page).get('q')).toBe('copper');
    await expect.poll(() => settledTitles(page)).not.toContain(ITO.title);
    expect(await text.inputValue()).toBe('copper');
    await page.goForward();
    await expect.poll(() => search(page).get('q')).toBe('sputtered film');
    await expect.poll(() => settledTitles(page)).toContain(ITO.title);
    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);

    // Each lab's curve from its dataset page into this browser's compare basket, coming back to the results by Back.
    const dois: string[] = [];
    for (const [i, deposit] of [COPPER, ITO].entries()) {
      const card = page.locator('main article').filter({ has: page.getByRole('link', { name: deposit.title, exact: true }) });
      dois.push((await card.locator('p.font-mono').innerText()).split(' · ')[0]);
      await card.getByRole('link', { name: deposit.title, exact: true }).click();
      await page.waitForURL(/\/datasets\/[0-9a-f-]{36}\/versions\/\d+$/);
      await page.getByRole('button', { name: 'Add this curve to compare' }).click();
      await expect.poll(() => page.getByRole('status').filter({ hasText: 'curve' }).first().innerText()).toContain(`Added · ${i + 1} curve`);
      await page.goBack();
      await expect.poll(() => search(page).get('q')).toBe('sputtered film');
      await expect.poll(() => settledTitles(page)).toContain(ITO.title);
    }
    expect(dois.every((d) => /^10\.\d+\//.test(d))).toBe(true);

    await page.goto(`${baseUrl}/compare`);
    await page.locator('canvas').first().waitFor({ timeout: 30_000 });
    const legend = page.getByRole('region', { name: 'Curves and sources' });
    for (const deposit of [COPPER, ITO]) await expect.poll(() => legend.innerText()).toContain(deposit.title);
    await page.getByLabel('Log y').check();
    await expect.poll(() => page.getByLabel('Log y').isChecked()).toBe(true);
    await page.locator('canvas').first().waitFor();

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'CSV (full resolution)' }).click();
    const csv = readFileSync((await (await download).path())!, 'utf8');
    const header = csv.split('\n').filter((l) => l.startsWith('#'));
    expect(header[0]).toBe('# Ohmstead compare export');
    for (const doi of dois) expect(header.some((l) => l.startsWith('# curve ') && l.includes(`https://doi.org/${doi}`))).toBe(true);
    expect(violations).toEqual([]);
    await context.close();
  });

  it('keeps the last results and focus through a slow answer, a refused range and a failed fetch, on a phone', async () => {
    const context = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const violations = await watchCsp(page);
    await openSearch(page, '/search?q=sputtered+film');
    expect(await settledTitles(page)).toContain(ITO.title);
    const filters = page.locator('details:has(form[aria-label="Filters"])');
    await filters.locator('summary').click();

    // A slow answer: the old cards stay, marked busy, and the ticked box keeps the focus when the answer lands.
    let release = () => {};
    const held = new Promise<void>((resolve) => {
      release = resolve;
    });
    await page.route(isSearchApi, async (route) => {
      await held;
      await route.continue();
    });
    const lab = page.getByRole('checkbox', { name: /Larkspur Cryogenic Lab/ });
    await lab.focus();
    await page.keyboard.press('Space');
    await expect.poll(() => search(page).getAll('group')).toEqual(['larkspur-cryogenic']);
    await expect.poll(() => page.locator('section[aria-labelledby="results-heading"]').getAttribute('aria-busy')).toBe('true');
    expect(await page.getByText('Updating results…').isVisible()).toBe(true);
    expect(await resultTitles(page)).toContain(ITO.title); // not blanked while waiting
    release();
    await expect.poll(() => settledTitles(page)).not.toContain(ITO.title);
    expect(await lab.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.unroute(isSearchApi);

    // A swapped range: the API's 400 in plain words at the top and at the field; the last results stay.
    await page.getByLabel('T from (K)').fill('300');
    await page.getByLabel('T to (K)').fill('2');
    await page.getByLabel('T to (K)').press('Enter');
    const alert = page.getByRole('alert').filter({ hasText: 'ends swapped' });
    await expect.poll(() => alert.innerText()).toContain('The lowest temperature (300 K) is above the highest (2 K).');
    expect(await page.getByLabel('T from (K)').getAttribute('aria-invalid')).toBe('true');
    expect(await resultTitles(page)).toContain(COPPER.title);

    // The network fails: a plain message, the results stay, and Try again fetches once the network is back.
    await page.route(isSearchApi, (route) => route.abort('internetdisconnected'));
    await page.getByLabel('T to (K)').fill('');
    await page.getByLabel('T from (K)').fill(String(BG_FILM.fromK + 1)); // a point the copper sweep includes
    await page.getByLabel('T from (K)').press('Enter');
    const failed = page.getByRole('alert').filter({ hasText: 'could not be updated' });
    await expect.poll(() => failed.innerText()).toContain('The server could not be reached.');
    expect(await resultTitles(page)).toContain(COPPER.title);
    await page.unroute(isSearchApi);
    await failed.getByRole('button', { name: 'Try again' }).click();
    await expect.poll(() => failed.count()).toBe(0);
    expect(await settledTitles(page)).toContain(COPPER.title);
    expect(search(page).get('tMin')).toBe(String(BG_FILM.fromK + 1));
    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);
    expect(violations).toEqual([]);
    await context.close();
  });

  it('follows typing after a pause with one history entry per typing, and pages with links that keep the search', async () => {
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const violations = await watchCsp(page);
    // One result a page: the three published demo versions make three pages.
    await openSearch(page, '/search?pageSize=1');
    const firstHeading = await heading(page).innerText();
    expect(firstHeading).toMatch(/ · page 1 of \d+$/);

    const text = page.getByLabel('Search text');
    await text.pressSequentially('copper', { delay: 30 });
    await expect.poll(() => search(page).get('q'), { timeout: 10_000 }).toBe('copper');
    expect(search(page).get('pageSize')).toBe('1');
    await text.pressSequentially(' film', { delay: 30 });
    await expect.poll(() => search(page).get('q'), { timeout: 10_000 }).toBe('copper film');
    await expect.poll(() => settledTitles(page)).toEqual([COPPER.title]);
    expect(await text.evaluate((el) => el === document.activeElement)).toBe(true); // the field keeps the focus
    // The pauses replaced one entry: Back goes to the search before the typing began.
    await page.goBack();
    await expect.poll(() => search(page).get('q')).toBeNull();
    expect(await text.inputValue()).toBe('');
    await expect.poll(() => heading(page).innerText()).toBe(firstHeading);

    // Next: page 2 in the URL, focus on the results heading (the link may vanish on the last page); Back: page 1.
    const firstTitles = await settledTitles(page);
    await page.getByRole('navigation', { name: 'Pages' }).getByRole('link', { name: 'Next' }).click();
    await expect.poll(() => search(page).get('page')).toBe('2');
    await expect.poll(() => heading(page).innerText()).toMatch(/ · page 2 of \d+$/);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('results-heading');
    expect(await settledTitles(page)).not.toEqual(firstTitles);
    expect(await page.getByRole('link', { name: 'Previous' }).getAttribute('href')).toBe('/search?pageSize=1');
    await page.goBack();
    await expect.poll(() => search(page).get('page')).toBeNull();
    await expect.poll(() => settledTitles(page)).toEqual(firstTitles);
    expect(violations).toEqual([]);
    await context.close();
  });

  it('serves a shared address with its results in the HTML and works as plain GET forms without JavaScript', async () => {
    const shared = `/search?q=sputtered+film&tMin=${T_FROM}&tMax=${T_TO}`;
    const response = await fetch(new URL(shared, baseUrl));
    expect(response.status).toBe(200);
    // The visible text of the HTML (scripts, which carry the page's data for React, left out).
    const text = (await response.text()).replace(/<script[\s\S]*?<\/script>/g, '').replace(/<[^>]+>/g, '');
    expect(text).toContain(COPPER.title);
    expect(text).not.toContain(ITO.title);

    const context = await browser().newContext({ viewport: { width: 1280, height: 900 }, javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/search?q=sputtered+film`);
    expect(await resultTitles(page)).toEqual(expect.arrayContaining([COPPER.title, ITO.title]));
    await page.getByLabel('T from (K)').fill(String(T_FROM));
    await page.getByLabel('T to (K)').fill(String(T_TO));
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL((url) => url.searchParams.get('tMin') === String(T_FROM));
    expect(search(page).get('q')).toBe('sputtered film');
    expect(await resultTitles(page)).toContain(COPPER.title);
    expect(await resultTitles(page)).not.toContain(ITO.title);
    await page.getByLabel('Search text').fill('copper');
    await page.locator('main').getByRole('button', { name: 'Search', exact: true }).click();
    await page.waitForURL((url) => url.searchParams.get('q') === 'copper');
    expect(search(page).get('tMin')).toBe(String(T_FROM)); // the text form carries the filters along
    expect(await resultTitles(page)).toContain(COPPER.title);
    await context.close();
  });
});
