// Group administration in Chromium against the app `npm test` serves: the demo owner invites a new address, the
// mail shows on the development mailbox page, the invitee signs in with an e-mailed link and accepts; the owner
// then sees the new member and removes them again. Demo accounts: db/seeds/demo-accounts.json.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import demo from '@/db/seeds/demo-accounts.json';
import { accessibilityProblems, baseUrl, browserForFile } from '@/tests/support/e2e';

const owner = demo.accounts.find((a) => a.email.startsWith('maren.'))!; // owner of larkspur-cryogenic
const GROUP = 'Larkspur Cryogenic Lab';

const browser = browserForFile();
// axe-core checks <main> only: the shared site header is checked by the other page tests, not here.
const A11Y_SCOPE = { within: 'main' };

/** The first link on /dev/mailbox in the newest message to `to` with this subject whose address contains `part`. */
async function linkFromMailbox(page: Page, to: string, subject: string, part: string): Promise<string> {
  const message = page.locator('main li').filter({ hasText: subject }).filter({ hasText: `to ${to}` }).first();
  await expect.poll(async () => {
    await page.goto(`${baseUrl}/dev/mailbox`);
    return message.count();
  }, { timeout: 30_000, interval: 1000 }).toBeGreaterThan(0);
  const href = await message.locator(`a[href*="${part}"]`).first().getAttribute('href');
  if (!href) throw new Error(`no ${part} link in the mail "${subject}" to ${to}`);
  return href;
}

describe('inviting a new person in Chromium', () => {
  it('the owner invites, the invitee finds the mail, signs in by link and accepts; the owner sees and removes them', async () => {
    const invitee = `e2e-invitee-${Date.now()}@invitee.example`;
    const ownerPage = await browser().newPage({ viewport: { width: 1280, height: 900 } });

    // The owner signs in and lands on the members page of their group.
    await ownerPage.goto(`${baseUrl}/groups/larkspur-cryogenic/members`);
    await ownerPage.waitForURL(/\/sign-in\?callbackUrl=/);
    await ownerPage.getByLabel('E-mail address', { exact: true }).first().fill(owner.email);
    await ownerPage.getByLabel('Password', { exact: true }).fill(demo.password);
    await ownerPage.getByRole('button', { name: 'Sign in', exact: true }).click();
    await ownerPage.waitForURL(`${baseUrl}/groups/larkspur-cryogenic/members`);
    expect(await ownerPage.getByRole('heading', { level: 1 }).innerText()).toBe(GROUP);
    expect(await accessibilityProblems(ownerPage, A11Y_SCOPE)).toEqual([]);

    // Invite as member; the page confirms the mail went out and lists the open invitation.
    await ownerPage.getByLabel('E-mail address', { exact: true }).fill(invitee);
    await ownerPage.getByLabel('Role', { exact: true }).selectOption('member');
    await ownerPage.getByRole('button', { name: 'Send invitation' }).click();
    await ownerPage.getByText(`Invitation sent to ${invitee}.`).waitFor();
    const open = ownerPage.locator('li').filter({ hasText: invitee });
    expect(await open.innerText()).toContain('Valid until');

    // The invitee has no account and no session: the mailbox page shows the invitation with its link.
    const guest = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await guest.newPage();
    const invitationUrl = await linkFromMailbox(page, invitee, `Invitation to join ${GROUP} on Ohmstead`, '/invitations/');
    expect(invitationUrl).toMatch(/\/invitations\/[A-Za-z0-9_-]{43}$/);
    await page.goto(invitationUrl);
    expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe(`Join ${GROUP}?`);
    expect(await page.locator('main').innerText()).toContain(`To accept, sign in with ${invitee}.`);
    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);

    // A sign-in link by e-mail creates the account and comes back to the invitation.
    await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
    await page.waitForURL(/\/sign-in\/check-email/);
    const signInUrl = await linkFromMailbox(page, invitee, 'Your Ohmstead sign-in link', '/api/auth/callback/email');
    await page.goto(signInUrl);
    await page.waitForURL(invitationUrl);

    // Signed in with the invited address: accept, and land on the members page as a member.
    await page.getByRole('button', { name: `Accept and join ${GROUP}` }).click();
    await page.waitForURL(/\/groups\/larkspur-cryogenic\/members\?welcome=1$/);
    expect(await page.getByRole('status').filter({ hasText: `Welcome to ${GROUP}` }).innerText()).toContain('You joined as member.');
    expect(await accessibilityProblems(page, A11Y_SCOPE)).toEqual([]);

    // The link is used up: opening it again says so.
    await page.goto(invitationUrl);
    expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe('Invitation accepted');

    // The owner sees the new member (named after the address's local part) and removes them, confirming first.
    await ownerPage.reload();
    const row = ownerPage.locator('main li').filter({ hasText: invitee });
    expect(await row.innerText()).not.toContain('Valid until'); // no longer an open invitation
    expect(await ownerPage.getByLabel(/^Role of e2e-invitee-/).inputValue()).toBe('member');
    await row.getByText('Remove…').click();
    await row.getByRole('button', { name: /^Remove e2e-invitee-/ }).click();
    await expect.poll(() => ownerPage.locator('main li').filter({ hasText: invitee }).count(), { timeout: 15_000 }).toBe(0);

    // The group's audit log shows the invitation, its acceptance and the removal, newest first.
    // The page streams after its loading state: wait for the table before reading it.
    await ownerPage.goto(`${baseUrl}/groups/larkspur-cryogenic/audit?actor=${encodeURIComponent(owner.email)}&action=group.member_removed`);
    await ownerPage.locator('main').getByText('Member removed').first().waitFor({ state: 'attached' });
    expect(await ownerPage.locator('main').innerText()).toContain('Member removed');
    await ownerPage.goto(`${baseUrl}/groups/larkspur-cryogenic/audit?action=group.invitation_accepted`);
    await ownerPage.locator('main').getByText(invitee).first().waitFor({ state: 'attached' });
    expect(await ownerPage.locator('main').innerText()).toContain(invitee);
    await guest.close();
    await ownerPage.close();
  });
});
