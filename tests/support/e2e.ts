// Browser tests: Chromium from Debian, driven by playwright-core, against the app `npm test` serves.
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

// Flags from stack.md; no --user-data-dir (Playwright refuses it and makes a fresh profile itself).
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export const baseUrl = process.env.E2E_BASE_URL ?? `http://localhost:${process.env.PORT ?? '3101'}`;

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
}

/** CSP violations reported by the console or by securitypolicyviolation events, for the whole life of the page. */
export async function watchCsp(page: Page): Promise<string[]> {
  const violations: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) violations.push(`${page.url()}: ${message.text()}`);
  });
  // Init scripts come through the DevTools protocol, so CSP does not block this listener itself.
  await page.exposeFunction('__cspViolation', (text: string) => violations.push(`${page.url()}: ${text}`));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      (window as unknown as { __cspViolation: (t: string) => void }).__cspViolation(`${event.violatedDirective} blocked ${event.blockedURI}`);
    });
  });
  return violations;
}
