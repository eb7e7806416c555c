// Compare in Chromium against the build `npm test` serves: a signed-in reuser puts the main curves of two demo labs'
// published datasets in the basket (found through the search API), overlays them, switches to a log axis and
// downloads the CSV, whose header must cite both DOIs and whose rows hold every point (full resolution).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { APIRequestContext } from 'playwright-core';
import demo from '@/db/seeds/demo-accounts.json';
import { accessibilityProblems, baseUrl, browserForFile } from '@/tests/support/e2e';

const reuser = demo.accounts.find((a) => a.email.startsWith('reuser@'))!; // signed-in reuser in no group
const LABS = ['larkspur-cryogenic', 'tidewater-thin-films'] as const;

type Hit = { doc: { versionId: string; title: string } };
type Entry = { key: string; source: { doi: string | null; title: string; group: { slug: string } }; chosen: { x: string; y: string }; options: { x: { column: string }; y: { column: string }; sourcePoints: number }[] };

const browser = browserForFile();

/** Adds the main curve of the first published dataset of `group` that has one (search API, then POST to the basket). */
async function addFirstCurveOf(request: APIRequestContext, group: string): Promise<string> {
  const search = await request.get(`${baseUrl}/api/v1/search?group=${group}&pageSize=20&sort=date`);
  expect(search.status(), `search for ${group}`).toBe(200);
  const { hits } = (await search.json()) as { hits: Hit[] };
  for (const hit of hits) {
    const added = await request.post(`${baseUrl}/api/v1/compare/items`, { data: { versionId: hit.doc.versionId } });
    if (added.status() === 201) return hit.doc.versionId;
    // 422: a published version without an analysed curve (e.g. metadata only), 403: files under embargo.
    expect([403, 422]).toContain(added.status());
  }
  throw new Error(`no published dataset of ${group} has a curve to compare (${hits.length} hits)`);
}

describe('comparing curves in Chromium', () => {
  it('overlays curves of two labs, switches to log y and exports a CSV citing both DOIs at full resolution', async () => {
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in?callbackUrl=%2Fcompare`);
    await page.getByLabel('E-mail address', { exact: true }).first().fill(reuser.email);
    await page.getByLabel('Password', { exact: true }).fill(demo.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${baseUrl}/compare`);

    // The page's request context shares the browser's session cookie.
    const api = page.request;
    expect((await api.delete(`${baseUrl}/api/v1/compare/items?all=true`)).status()).toBe(200);
    for (const lab of LABS) await addFirstCurveOf(api, lab);
    const basket = (await (await api.get(`${baseUrl}/api/v1/compare/items`)).json()) as { entries: Entry[]; unavailable: unknown[] };
    expect(basket.entries.map((e) => e.source.group.slug)).toEqual([...LABS]);
    const dois = basket.entries.map((e) => e.source.doi);
    expect(dois.every((d) => typeof d === 'string' && d.length > 0)).toBe(true);

    await page.goto(`${baseUrl}/compare`);
    await page.locator('canvas').first().waitFor({ timeout: 30_000 });
    const legend = page.getByRole('region', { name: 'Curves and sources' });
    for (const e of basket.entries) {
      await expect.poll(() => legend.innerText()).toContain(e.source.title);
      await expect.poll(() => legend.innerText()).toContain(`https://doi.org/${e.source.doi}`);
    }
    expect(await accessibilityProblems(page)).toEqual([]);

    // Log y: the plot is drawn again (uPlot replaces its canvas) and stays up.
    await page.getByLabel('Log y').check();
    await expect.poll(() => page.getByLabel('Log y').isChecked()).toBe(true);
    await page.locator('canvas').first().waitFor();
    expect(await page.getByRole('img').first().getAttribute('aria-label')).toMatch(/against .*2 curves/);

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'CSV (full resolution)' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/^ohmstead-compare-\d{4}-\d{2}-\d{2}\.csv$/);
    const csv = readFileSync((await file.path())!, 'utf8');
    const lines = csv.trimEnd().split('\n');
    const header = lines.filter((l) => l.startsWith('#'));
    expect(header[0]).toBe('# Ohmstead compare export');
    for (const [i, doi] of dois.entries()) {
      expect(header.find((l) => l.startsWith(`# curve ${i + 1}: `))).toContain(`https://doi.org/${doi}`);
    }
    const columns = lines[header.length];
    expect(columns).toMatch(/^curve,[a-z ]+ \([^)]+\),[a-z ]+ \([^)]+\)$/);
    // Full resolution: each curve has a row for every point of its file (the preview keeps at most 500 of them).
    for (const [i, e] of basket.entries.entries()) {
      const cite = header.find((l) => l.startsWith(`# curve ${i + 1}: `))!;
      const [, x, y, points] = / — columns (.+) and (\S+)(?: \(computed[^)]*\))? — (\d+) points/.exec(cite)!;
      const option = e.options.find((o) => o.x.column === x && o.y.column === y)!;
      expect(Number(points)).toBe(option.sourcePoints);
      expect(lines.filter((l) => l.startsWith(`${i + 1},`)).length).toBe(option.sourcePoints);
    }
    await api.delete(`${baseUrl}/api/v1/compare/items?all=true`);
    await context.close();
  });

  it('shows the empty state with the way to Search to a visitor with no curves', async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(`${baseUrl}/compare`);
    await expect.poll(() => page.getByText('No curves yet — find some through').isVisible()).toBe(true);
    expect(await page.getByRole('link', { name: 'Search', exact: true }).last().getAttribute('href')).toBe('/search');
    await page.close();
  });
});
