// Sign in with ORCID in Chromium, against the local ORCID fake that `npm test` starts (ORCID_ISSUER): the app's
// button, the fake's researcher page, next-auth's callback with PKCE and state, and the iD shown in settings.
import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import { RESEARCHERS } from '@/scripts/fakes/orcid-researchers';
import { baseUrl, browserForFile } from '@/tests/support/e2e';
import { requireEnv } from '@/tests/support/services';

const issuer = requireEnv('ORCID_ISSUER');

const browser = browserForFile();

async function signInWithOrcidAs(fullName: string) {
  const page = await browser().newPage();
  await page.goto(`${baseUrl}/sign-in?callbackUrl=${encodeURIComponent('/settings/tokens')}`);
  await page.getByRole('button', { name: 'Sign in with ORCID' }).click();
  await page.waitForURL((url) => url.href.startsWith(`${issuer}/authorize`));
  await page.getByRole('button', { name: `Sign in as ${fullName}` }).click();
  await page.waitForURL(`${baseUrl}/settings/tokens`);
  return page;
}

describe('Sign in with ORCID in Chromium', () => {
  it('a researcher new to Ohmstead gets an account with their iD linked', async () => {
    const wynn = RESEARCHERS.find((r) => r.email === null)!;
    const page = await signInWithOrcidAs('Wynn Harrowgate');
    const account = page.locator('section[aria-labelledby="account-heading"]');
    expect(await account.innerText()).toContain('Signed in as Wynn Harrowgate');
    expect(await page.getByTestId('account-orcid').innerText()).toBe(`ORCID iD ${wynn.orcid}`);
    expect(await page.locator('summary[aria-label="Account menu for Wynn Harrowgate"]').count()).toBe(1);
    await page.close();
  });

  it('a demo researcher whose confirmed e-mail matches lands in their existing account', async () => {
    const ada = RESEARCHERS.find((r) => r.email?.startsWith('ada.'))!;
    const demoAda = demo.accounts.find((a) => a.email === ada.email)!;
    const page = await signInWithOrcidAs(`${ada.givenName} ${ada.familyName}`);
    const account = page.locator('section[aria-labelledby="account-heading"]');
    expect(await account.innerText()).toContain(`Signed in as ${demoAda.name} (${demoAda.email})`);
    expect(await page.getByTestId('account-orcid').innerText()).toBe(`ORCID iD ${ada.orcid}`);
    // The linked iD is public on the group page of a group she belongs to.
    await page.goto(`${baseUrl}/groups/${demoAda.group}`);
    expect(await page.locator('main').innerText()).toContain(`ORCID ${ada.orcid}`);
    await page.close();
  });
});
