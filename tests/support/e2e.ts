// Browser tests: Chromium from Debian, driven by playwright-core, against the app `npm test` serves; axe-core checks
// accessibility in the page.
import { createRequire } from 'node:module';
import type AxeCore from 'axe-core';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

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

/**
 * One Chromium for the test file that calls this at its top level: launched in beforeAll, closed in afterAll.
 * Returns a getter for it (the browser exists only once beforeAll has run).
 */
export function browserForFile(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('Chromium is not running: call the getter from browserForFile() inside a test or hook');
    return browser;
  };
}

/** Which part of the page axe-core checks; by default the whole document. */
export type AccessibilityScope = {
  /** CSS selector of the one element to check (the whole document if the page has none). */
  within?: string;
  /** CSS selectors of elements left out of the check. */
  exclude?: string[];
};

/** The WCAG 2.2 AA rule tags axe-core runs. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21aa', 'wcag22aa'];

/** axe-core's serious and critical findings (WCAG 2.2 AA rules) on the page as it is now, one `rule: targets` line each. */
export async function accessibilityProblems(page: Page, scope: AccessibilityScope = {}): Promise<string[]> {
  await page.addScriptTag({ path: createRequire(import.meta.url).resolve('axe-core/axe.min.js') });
  return page.evaluate(async ({ within, exclude, tags }) => {
    const { axe } = window as unknown as { axe: typeof AxeCore };
    const root = within === undefined ? document : (document.querySelector(within) ?? document);
    let context: AxeCore.ElementContext = root;
    if (exclude !== undefined) {
      const left = exclude.map((selector) => [selector]);
      context = within === undefined ? { exclude: left } : { include: [root], exclude: left };
    }
    const result = await axe.run(context, { runOnly: { type: 'tag', values: tags } });
    return result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  }, { within: scope.within, exclude: scope.exclude, tags: WCAG_TAGS });
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
