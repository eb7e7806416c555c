import { describe, expect, it } from 'vitest';
import demo from '@/db/seeds/demo-accounts.json';
import { HttpSession } from '@/tests/support/http-session';
import { waitForMail } from '@/tests/support/mailbox';
import { uniqueEmail } from '@/tests/support/unique';
import { baseUrl } from '@/tests/support/e2e';

const author = demo.accounts.find((a) => a.email.startsWith('ada.'))!;

describe('sign-in over HTTP (next-auth credentials and e-mail providers)', () => {
  it('signs the demo author in with a JWT session carrying id and site role, then signs out', async () => {
    const http = new HttpSession(baseUrl);
    const response = await http.signInWithPassword(author.email, demo.password);
    expect(response.status).toBe(200);
    const session = await http.session();
    expect(session.user).toMatchObject({ email: author.email, name: author.name, siteRole: 'user' });
    expect(session.user?.id).toMatch(/^[0-9a-f-]{36}$/);

    const csrfToken = await http.csrfToken();
    await http.postForm('/api/auth/signout', { csrfToken, json: 'true' });
    expect((await http.session()).user).toBeUndefined();
  });

  it('refuses a wrong password and keeps the visitor signed out', async () => {
    const http = new HttpSession(baseUrl);
    const response = await http.signInWithPassword(author.email, 'not the password at all');
    expect(response.status).toBe(401);
    expect((await http.session()).user).toBeUndefined();
  });

  it('sets the session cookie HttpOnly and SameSite=Lax', async () => {
    const csrf = await fetch(new URL('/api/auth/csrf', baseUrl));
    const line = csrf.headers.getSetCookie().find((l) => l.includes('csrf-token'));
    expect(line).toMatch(/HttpOnly/i);
    expect(line).toMatch(/SameSite=Lax/i);
  });

  it('mails a sign-in link through the SMTP fake; opening it signs the user in once', async () => {
    const email = uniqueEmail('link');
    const http = new HttpSession(baseUrl);
    const csrfToken = await http.csrfToken();
    const response = await http.postForm('/api/auth/signin/email', { csrfToken, email, callbackUrl: `${baseUrl}/groups`, json: 'true' });
    expect(response.status).toBe(200);
    const mail = await waitForMail({ to: email, subject: /sign-in link/, timeoutMs: 15_000 });
    const link = mail.links.find((l) => l.includes('/api/auth/callback/email'));
    expect(link).toBeTruthy();

    const opened = await http.fetch(new URL(link!).pathname + new URL(link!).search);
    expect(opened.status).toBe(302);
    expect((await http.session()).user).toMatchObject({ email });

    const again = await new HttpSession(baseUrl).fetch(new URL(link!).pathname + new URL(link!).search);
    expect(again.headers.get('location')).toMatch(/error=Verification/);
  });
});

describe('health', () => {
  it('reports every service up', async () => {
    const response = await fetch(new URL('/api/health', baseUrl));
    const body = (await response.json()) as { status: string; services: { name: string; ok: boolean }[]; search: { state: string } };
    expect(response.status).toBe(200);
    expect(body.status).toBe('ok');
    expect(body.services.map((s) => [s.name, s.ok])).toEqual([
      ['database', true], ['object-storage', true], ['smtp', true], ['doi-registration', true],
    ]);
    expect(['building', 'ready']).toContain(body.search.state); // the server starts building it as it starts
  });

  it('answers the liveness probe without touching any service, with the security headers', async () => {
    const response = await fetch(new URL('/api/health/live', baseUrl));
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ status: 'ok' });
    expect(response.headers.get('cache-control')).toBe('no-store');
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
  });
});
