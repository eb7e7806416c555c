// The public dataset page in Chromium, as an anonymous visitor reaches it from the published list: an open dataset
// with DOI, citations and files, and an embargoed one with its lock and no curves. axe-core checks both.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { accessibilityProblems, baseUrl, browserForFile } from '@/tests/support/e2e';

const browser = browserForFile();
// axe-core checks the page below the site header, which is the shell's.
const A11Y_SCOPE = { exclude: ['body > header'] };

/** The address of the first published card (search page, then home page) that does or does not show an embargo. */
async function publishedCardHref(page: Page, embargoed: boolean): Promise<string> {
  for (const listing of ['/search', '/']) {
    await page.goto(`${baseUrl}${listing}`);
    const cards = page.locator('main li').filter({ has: page.locator('a[href^="/datasets/"]') });
    for (let i = 0; i < (await cards.count()); i++) {
      const card = cards.nth(i);
      if ((await card.innerText()).includes('Files under embargo') !== embargoed) continue; // search cards and home cards word the lock differently
      const href = await card.locator('a[href^="/datasets/"]').first().getAttribute('href');
      if (href) return href;
    }
  }
  throw new Error(`the demo lists no published dataset ${embargoed ? 'with' : 'without'} an embargo`);
}

describe('the dataset page for an anonymous visitor', () => {
  it('shows title, DOI, the four citation formats and the files with their SHA-256', async () => {
    const page = await browser().newPage({ viewport: { width: 1280, height: 900 } });
    const href = await publishedCardHref(page, false);
    expect(href).toMatch(/^\/datasets\/[0-9a-f-]{36}\/versions\/\d+$/);
    const response = await page.goto(`${baseUrl}${href}`);
    expect(response?.status()).toBe(200);

    const heading = page.getByRole('heading', { level: 1 });
    await heading.waitFor();
    const title = (await heading.innerText()).trim();
    expect(title.length).toBeGreaterThan(5);
    expect(await page.title()).toContain(title);
    const doi = page.locator('header a[href^="https://doi.org/10."]').first();
    expect(await doi.innerText()).toMatch(/^https:\/\/doi\.org\/10\.\d+\/.+/);

    const tabs = page.getByRole('tablist', { name: 'Citation format' }).getByRole('tab');
    expect(await tabs.allInnerTexts()).toEqual(['Text', 'BibTeX', 'RIS', 'CSL-JSON']);
    const citation = page.getByRole('tabpanel').locator('pre');
    expect(await citation.innerText()).toContain((await doi.innerText()).trim());
    await page.getByRole('tab', { name: 'RIS' }).click();
    expect(await citation.innerText()).toMatch(/^TY {2}- DATA/);
    await page.getByRole('tab', { name: 'CSL-JSON' }).click();
    expect(JSON.parse(await citation.innerText())[0]).toMatchObject({ type: 'dataset', title });

    const files = page.locator('#files table');
    const rows = files.locator('tbody tr');
    expect(await rows.count()).toBeGreaterThan(0);
    expect(await rows.first().locator('code').innerText()).toMatch(/^[0-9a-f]{64}$/);
    expect(await rows.first().getByRole('link', { name: /^Download/ }).getAttribute('href')).toMatch(/^\/api\/v1\/files\/[0-9a-f-]{36}\/download$/);

    const jsonLd = JSON.parse(await page.locator('script[type="application/ld+json"]').innerText());
    expect(jsonLd).toMatchObject({ '@context': 'https://schema.org', '@type': 'Dataset', name: title });

    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);
    await page.close();
  });

  it('shows an embargoed dataset with its lock and date, and no curves or download links', async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    const href = await publishedCardHref(page, true);
    await page.goto(`${baseUrl}${href}`);
    const lock = page.locator('article header').getByText(/Files open on \d{4}-\d{2}-\d{2} at 00:00 UTC/);
    await lock.waitFor();
    expect(await lock.count()).toBe(1);
    expect(await page.locator('#curves').innerText()).toMatch(/under embargo until \d{4}-\d{2}-\d{2} at 00:00 UTC/);
    expect(await page.locator('#curves canvas').count()).toBe(0);
    expect(await page.locator('#files').getByRole('link', { name: /^Download/ }).count()).toBe(0);
    expect(await page.locator('#files tbody tr').count()).toBeGreaterThan(0);
    // A phone-width page never scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBe(0);
    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);
    await page.close();
  });

  it('answers 404 for an unknown dataset and for a version that does not exist', async () => {
    const page = await browser().newPage();
    expect((await page.goto(`${baseUrl}/datasets/00000000-0000-4000-8000-000000000000`))?.status()).toBe(404);
    const href = await publishedCardHref(page, false);
    expect((await page.goto(`${baseUrl}${href.replace(/\d+$/, '999')}`))?.status()).toBe(404);
    await page.close();
  });
});
