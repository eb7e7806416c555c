import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, newNonce, securityHeaders } from '@/lib/http/security-headers';
import { isCrossSiteMutation } from '@/lib/http/cross-site';

const devEnv = { NEXTAUTH_URL: 'http://localhost:3000', S3_ENDPOINT: 'http://127.0.0.1:4568', NODE_ENV: 'production' };

describe('content security policy', () => {
  it('carries the nonce, strict-dynamic, wasm for hash-wasm and the object-store origin for presigned URLs', () => {
    const csp = contentSecurityPolicy('abc123==', devEnv);
    expect(csp).toContain("script-src 'self' 'nonce-abc123==' 'strict-dynamic' 'wasm-unsafe-eval'");
    expect(csp).not.toContain("'unsafe-eval'");
    expect(csp).toContain("connect-src 'self' http://127.0.0.1:4568");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("form-action 'self'");
  });

  it('prefers S3_PUBLIC_ENDPOINT and allows the ORCID issuer as a form target', () => {
    const csp = contentSecurityPolicy('n', { ...devEnv, S3_PUBLIC_ENDPOINT: 'https://files.example.test/bucket', ORCID_ISSUER: 'https://id.example.test/oauth' });
    expect(csp).toContain("connect-src 'self' https://files.example.test;");
    expect(csp).toContain("form-action 'self' https://id.example.test;");
  });

  it('adds unsafe-eval only for the development build (React dev stack traces)', () => {
    expect(contentSecurityPolicy('n', { ...devEnv, NODE_ENV: 'development' })).toContain("'wasm-unsafe-eval' 'unsafe-eval'");
  });

  it('makes a different 16-byte nonce each time', () => {
    const a = newNonce();
    expect(Buffer.from(a, 'base64')).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });
});

describe('security headers', () => {
  it('uses no-referrer on reviewer links and strict-origin-when-cross-origin elsewhere', () => {
    expect(securityHeaders('/review/tok123', 'n', devEnv)['Referrer-Policy']).toBe('no-referrer');
    expect(securityHeaders('/reviews', 'n', devEnv)['Referrer-Policy']).toBe('strict-origin-when-cross-origin');
    expect(securityHeaders('/search', 'n', devEnv)).toMatchObject({
      'X-Content-Type-Options': 'nosniff',
      'Cross-Origin-Opener-Policy': 'same-origin',
    });
  });

  it('sends HSTS only when NEXTAUTH_URL is https', () => {
    expect(securityHeaders('/', 'n', devEnv)['Strict-Transport-Security']).toBeUndefined();
    expect(securityHeaders('/', 'n', { ...devEnv, NEXTAUTH_URL: 'https://ohmstead.example.test' })['Strict-Transport-Security']).toBe(
      'max-age=31536000; includeSubDomains',
    );
  });
});

describe('cross-site mutation check (CSRF)', () => {
  const site = 'http://localhost:3000';
  const req = (method: string, headers: Record<string, string>) => new Request(`${site}/api/v1/drafts`, { method, headers });

  it('refuses a POST whose Origin is another site, or the opaque "null" origin', () => {
    expect(isCrossSiteMutation(req('POST', { origin: 'https://evil.example.test' }), site)).toBe(true);
    expect(isCrossSiteMutation(req('DELETE', { origin: 'null' }), site)).toBe(true);
    expect(isCrossSiteMutation(req('PUT', { origin: 'http://localhost:3001' }), site)).toBe(true);
  });

  it('accepts same-origin changes, safe methods from anywhere, and requests with no browser headers', () => {
    expect(isCrossSiteMutation(req('POST', { origin: site }), site)).toBe(false);
    expect(isCrossSiteMutation(req('GET', { origin: 'https://evil.example.test' }), site)).toBe(false);
    expect(isCrossSiteMutation(req('PATCH', {}), site)).toBe(false);
  });

  it('falls back to Sec-Fetch-Site when Origin is missing', () => {
    expect(isCrossSiteMutation(req('POST', { 'sec-fetch-site': 'cross-site' }), site)).toBe(true);
    expect(isCrossSiteMutation(req('POST', { 'sec-fetch-site': 'same-origin' }), site)).toBe(false);
  });
});

describe('no page needs eval', () => {
  it("the deposit workspace gets the same script policy as every page in production (its validator is precompiled)", () => {
    const env = { NODE_ENV: 'production', NEXTAUTH_URL: 'http://localhost:3000', S3_ENDPOINT: 'http://127.0.0.1:4568' } as Parameters<typeof securityHeaders>[2];
    for (const page of ['/deposit', '/deposit/0b6f3e2a-8c1d-4e5f-9a7b-2c3d4e5f6a7b', '/search']) {
      expect(securityHeaders(page, 'n', env)['Content-Security-Policy']).not.toContain("'unsafe-eval'");
    }
  });
});
