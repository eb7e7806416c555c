import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import demo from '@/db/seeds/demo-accounts.json';
import { HttpSession } from '@/tests/support/http-session';
import { baseUrl, browserForFile, watchCsp } from '@/tests/support/e2e';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!;
const evil = 'https://evil.example.test';

const browser = browserForFile();

const nonceOf = (csp: string | null) => /'nonce-([^']+)'/.exec(csp ?? '')?.[1];

describe('security headers over HTTP', () => {
  it('a page carries a CSP with a fresh nonce per request and the other security headers', async () => {
    const first = await fetch(new URL('/search', baseUrl));
    const second = await fetch(new URL('/search', baseUrl));
    const csp = first.headers.get('content-security-policy');
    expect(csp).toContain("'strict-dynamic'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(nonceOf(csp)).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(nonceOf(second.headers.get('content-security-policy'))).not.toBe(nonceOf(csp));
    // Next stamps the same nonce on its own script tags while rendering.
    expect(await first.text()).toContain(`nonce="${nonceOf(csp)}"`);
    expect(first.headers.get('x-content-type-options')).toBe('nosniff');
    expect(first.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(first.headers.get('cross-origin-opener-policy')).toBe('same-origin');
    expect(first.headers.get('permissions-policy')).toContain('camera=()');
    // HSTS belongs to https deployments only; the test server is plain http.
    expect(first.headers.get('strict-transport-security')).toBe(baseUrl.startsWith('https:') ? 'max-age=31536000; includeSubDomains' : null);
  });

  it('an API route carries the headers too, and reviewer links send no referrer', async () => {
    const api = await fetch(new URL('/api/v1/openapi.json', baseUrl));
    expect(api.headers.get('x-content-type-options')).toBe('nosniff');
    expect(api.headers.get('content-security-policy')).toContain("default-src 'self'");
    const review = await fetch(new URL('/review/not-a-real-token', baseUrl));
    expect(review.headers.get('referrer-policy')).toBe('no-referrer');
  });
});

describe('cookies and CSRF', () => {
  it('the session cookie from the credentials callback is HttpOnly, SameSite=Lax, Secure only on https', async () => {
    const http = new HttpSession(baseUrl);
    const csrfToken = await http.csrfToken();
    const response = await http.postForm('/api/auth/callback/credentials', { csrfToken, email: author.email, password: demo.password, json: 'true' });
    expect(response.status).toBe(200);
    const line = response.headers.getSetCookie().find((l) => /session-token=/.test(l));
    expect(line).toMatch(/HttpOnly/i);
    expect(line).toMatch(/SameSite=Lax/i);
    expect(/;\s*Secure/i.test(line!)).toBe(baseUrl.startsWith('https:'));
  });

  it('session fixation: a cookie planted before sign-in is not the session afterwards', async () => {
    const planted = 'next-auth.session-token=planted-by-attacker';
    const csrf = await fetch(new URL('/api/auth/csrf', baseUrl), { headers: { cookie: planted } });
    const csrfCookie = csrf.headers.getSetCookie().map((l) => l.split(';')[0]).join('; ');
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const response = await fetch(new URL('/api/auth/callback/credentials', baseUrl), {
      method: 'POST',
      redirect: 'manual',
      headers: { cookie: `${planted}; ${csrfCookie}`, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email: author.email, password: demo.password, json: 'true' }).toString(),
    });
    const issued = response.headers.getSetCookie().find((l) => /session-token=/.test(l))!;
    expect(response.status).toBe(200);
    expect(issued.split(';')[0]).not.toBe(planted);
  });

  it('a cross-origin POST riding on the session cookie is refused with 403; the same POST from our origin is not', async () => {
    const http = new HttpSession(baseUrl);
    expect((await http.signInWithPassword(author.email, demo.password)).status).toBe(200);
    const body = JSON.stringify({ name: 'csrf probe', scopes: ['read'], expiresInDays: 1 });
    const headers = { 'content-type': 'application/json' };
    const refused = await http.fetch('/api/v1/tokens', { method: 'POST', body, headers: { ...headers, origin: evil } });
    expect(refused.status).toBe(403);
    const error = ((await refused.json()) as { error: { code: string; message: string } }).error;
    expect(error.code).toBe('forbidden');
    expect(error.message).toContain('came from another site');
    const viaFetchMetadata = await http.fetch('/api/v1/tokens', { method: 'POST', body, headers: { ...headers, 'sec-fetch-site': 'cross-site' } });
    expect(viaFetchMetadata.status).toBe(403);
    const allowed = await http.fetch('/api/v1/tokens', { method: 'POST', body, headers: { ...headers, origin: new URL(baseUrl).origin } });
    expect(allowed.status).toBe(201);
    // Leave the demo account's token list as it was.
    const { id } = (await allowed.json()) as { id: string };
    const revoked = await http.fetch(`/api/v1/tokens/${id}`, { method: 'DELETE', headers: { origin: new URL(baseUrl).origin } });
    expect(revoked.status).toBe(200);
  });

  // Server actions (lib/http/action.ts runAction) need no check of their own: Next 16 compares the Origin host with
  // x-forwarded-host (else Host) and aborts a mismatch before the action runs — read in
  // node_modules/next/dist/server/app-render/action-handler.js ("Invalid Server Actions request", unless listed in
  // serverActions.allowedOrigins, which we leave empty). Our reverse proxy must pass the public Host through.
  // next-auth's own POST routes check their double-submit csrfToken, as this test shows.
  it('next-auth refuses a sign-out POST without its CSRF token', async () => {
    const http = new HttpSession(baseUrl);
    await http.signInWithPassword(author.email, demo.password);
    await http.postForm('/api/auth/signout', { json: 'true' });
    expect((await http.session()).user?.email).toBe(author.email);
  });
});

async function visit(page: Page, path: string): Promise<void> {
  const response = await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' });
  expect(response?.status(), path).toBeLessThan(400);
}

describe('Content-Security-Policy in Chromium', () => {
  it('public pages, the API page and sign-in run without a single CSP violation', async () => {
    const page = await browser().newPage();
    const violations = await watchCsp(page);
    for (const path of ['/', '/search', '/groups', '/compare', '/api-docs', '/sign-in']) await visit(page, path);
    await visit(page, '/search');
    const landing = await page.locator('main a[href^="/datasets/"]').first().getAttribute('href');
    expect(landing).toMatch(/^\/datasets\//);
    await visit(page, landing!);
    // The JSON-LD block is data (type application/ld+json), which CSP does not govern: it needs no nonce.
    expect(await page.locator('script[type="application/ld+json"]').count()).toBe(1);
    expect(violations).toEqual([]);
    await page.close();
  });

  it('signed in, the deposit page and a draft workspace run without a CSP violation', async () => {
    const page = await browser().newPage();
    const violations = await watchCsp(page);
    await visit(page, '/sign-in');
    await page.getByLabel('E-mail address', { exact: true }).first().fill(author.email);
    await page.getByLabel('Password', { exact: true }).fill(demo.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${baseUrl}/groups`);
    await visit(page, '/deposit');
    const draft = await page.locator('main a[href^="/deposit/"]').first().getAttribute('href');
    expect(draft).toMatch(/^\/deposit\/[0-9a-f-]{36}$/);
    await visit(page, draft!);
    expect(violations).toEqual([]);
    await page.close();
  });
});
