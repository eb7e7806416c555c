// A tiny cookie-keeping HTTP client for scripting next-auth's flows as a browser would (stack.md: csrf → callback).
export class HttpSession {
  private cookies = new Map<string, string>();

  constructor(readonly baseUrl: string) {}

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  cookieNames(): string[] {
    return [...this.cookies.keys()];
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    const response = await fetch(new URL(path, this.baseUrl), { ...init, headers, redirect: 'manual' });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      const name = pair!.slice(0, eq).trim();
      const value = pair!.slice(eq + 1).trim();
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return response;
  }

  async csrfToken(): Promise<string> {
    const response = await this.fetch('/api/auth/csrf');
    return ((await response.json()) as { csrfToken: string }).csrfToken;
  }

  async postForm(path: string, fields: Record<string, string>): Promise<Response> {
    return this.fetch(path, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams(fields).toString() });
  }

  async session(): Promise<{ user?: { id: string; email: string; name: string; siteRole: string } }> {
    const response = await this.fetch('/api/auth/session');
    return (await response.json()) as { user?: { id: string; email: string; name: string; siteRole: string } };
  }

  async signInWithPassword(email: string, password: string): Promise<Response> {
    const csrfToken = await this.csrfToken();
    return this.postForm('/api/auth/callback/credentials', { csrfToken, email, password, json: 'true' });
  }
}
