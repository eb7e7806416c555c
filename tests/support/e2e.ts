// Browser tests: Chromium from Debian, driven by playwright-core, against the app `npm test` serves.
import { chromium, type Browser } from 'playwright-core';

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
