import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import { baseUrl, browserForFile } from '@/tests/support/e2e';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!;

const browser = browserForFile();

describe('signing in in Chromium', () => {
  it('the demo author signs in and sees their groups with roles', async () => {
    const page = await browser().newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail address', { exact: true }).first().fill(author.email);
    await page.getByLabel('Password', { exact: true }).fill(demo.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${baseUrl}/groups`);
    const mine = page.locator('section[aria-labelledby="mine"]');
    expect(await mine.innerText()).toContain('Larkspur Cryogenic Lab');
    expect(await mine.innerText()).toContain('Tidewater Thin Films Group');
    expect(await page.locator(`summary[aria-label="Account menu for ${author.name}"]`).count()).toBe(1);
    await page.close();
  });

  it('a wrong password shows an error and stays on the sign-in page', async () => {
    const page = await browser().newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail address', { exact: true }).first().fill(author.email);
    await page.getByLabel('Password', { exact: true }).fill('definitely wrong');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    // Next.js keeps an empty route-announcer alert in every page; look for ours by its text.
    const alert = page.getByRole('alert').filter({ hasText: 'E-mail or password is wrong' });
    await alert.waitFor();
    expect(await alert.innerText()).toContain('E-mail or password is wrong');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.close();
  });
});
