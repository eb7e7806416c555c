// The local ORCID sign-in fake, started as scripts/stack starts it, driven through the OpenID Connect code flow with
// fetch. Protocol facts: OpenID Connect Core 1.0 (§3.1 code flow, §3.1.3.6 at_hash), Discovery 1.0, RFC 6749 and
// RFC 7636 (PKCE S256). The id_token is verified with jose against the fake's /jwks, as next-auth's client does.
import { createHash, randomBytes } from 'node:crypto';
import { createRemoteJWKSet, decodeProtectedHeader, jwtVerify } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isValidOrcid } from '@/lib/schema/orcid';
import { RESEARCHERS, testOrcid } from '@/scripts/fakes/orcid-researchers';
import { chooseResearcher, startOrcidFake, type RunningFake } from './start-fake';

const APP = 'http://localhost:3999';
const REDIRECT = `${APP}/api/auth/callback/orcid`;
const CLIENT_ID = 'APP-OHMSTEAD-TEST';
const CLIENT_SECRET = randomBytes(18).toString('base64url');
let fake: RunningFake;
let issuer = '';

beforeAll(async () => {
  fake = await startOrcidFake({ clientId: CLIENT_ID, clientSecret: CLIENT_SECRET, appUrl: APP });
  issuer = fake.issuer;
});
afterAll(async () => {
  await fake?.stop();
});

const pkce = () => {
  const verifier = randomBytes(32).toString('base64url');
  return { verifier, challenge: createHash('sha256').update(verifier).digest('base64url') };
};

function authorizeUrl(params: Record<string, string>): string {
  const q = new URLSearchParams({ client_id: CLIENT_ID, redirect_uri: REDIRECT, response_type: 'code', scope: 'openid', ...params });
  return `${issuer}/authorize?${q}`;
}

/** Opens the chooser page and picks a researcher; returns the redirect back to the app. */
async function signInAs(orcid: string, challenge: string, extra: Record<string, string> = {}): Promise<URL> {
  return new URL(await chooseResearcher(authorizeUrl({ code_challenge: challenge, code_challenge_method: 'S256', state: 'st-1', ...extra }), orcid));
}

async function exchange(form: Record<string, string>, headers: Record<string, string> = {}) {
  const res = await fetch(`${issuer}/token`, {
    method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded', ...headers }, body: new URLSearchParams(form),
  });
  return { status: res.status, cache: res.headers.get('cache-control'), body: (await res.json()) as Record<string, string> };
}

const ada = RESEARCHERS[0]!;
const wynn = RESEARCHERS.find((r) => r.email === null)!;

describe('ORCID sign-in fake', () => {
  it('offers invented researchers whose iDs have valid check digits in the unissued 0000-0000 block', () => {
    // ISO 7064 MOD 11-2 by hand for base 000000000000101: total = (total + digit) × 2 runs 0 … 2, 4, 10; (12 − 10 mod 11) mod 11 = 2.
    expect(testOrcid(101)).toBe('0000-0000-0000-1012');
    for (const r of RESEARCHERS) {
      expect(isValidOrcid(r.orcid)).toBe(true);
      expect(r.orcid.startsWith('0000-0000-')).toBe(true);
    }
    expect(new Set(RESEARCHERS.map((r) => r.orcid)).size).toBe(RESEARCHERS.length);
  });

  it('publishes discovery metadata for the code flow with PKCE S256 and RS256 id_tokens', async () => {
    const doc = (await (await fetch(`${issuer}/.well-known/openid-configuration`)).json()) as Record<string, unknown>;
    expect(doc).toMatchObject({
      issuer, authorization_endpoint: `${issuer}/authorize`, token_endpoint: `${issuer}/token`, jwks_uri: `${issuer}/jwks`,
      userinfo_endpoint: `${issuer}/userinfo`, response_types_supported: ['code'], code_challenge_methods_supported: ['S256'],
      id_token_signing_alg_values_supported: ['RS256'],
    });
  });

  it('runs the whole code flow: state and iss come back, the id_token verifies against /jwks, userinfo answers', async () => {
    const { verifier, challenge } = pkce();
    const back = await signInAs(ada.orcid, challenge, { nonce: 'n-0S6_WzA2Mj' });
    expect(back.origin + back.pathname).toBe(REDIRECT);
    expect(back.searchParams.get('state')).toBe('st-1');
    expect(back.searchParams.get('iss')).toBe(issuer);
    const code = back.searchParams.get('code') ?? '';
    expect(code).toMatch(/^[A-Za-z0-9_-]{32}$/);

    const tokens = await exchange({ grant_type: 'authorization_code', code, redirect_uri: REDIRECT, code_verifier: verifier, client_id: CLIENT_ID, client_secret: CLIENT_SECRET });
    expect(tokens.status).toBe(200);
    expect(tokens.cache).toBe('no-store'); // RFC 6749 §5.1
    expect(tokens.body).toMatchObject({ token_type: 'bearer', scope: 'openid', orcid: ada.orcid, name: 'Ada Penhallow' });

    const { payload, protectedHeader } = await jwtVerify(tokens.body.id_token!, createRemoteJWKSet(new URL(`${issuer}/jwks`)), { issuer, audience: CLIENT_ID });
    expect(protectedHeader.alg).toBe('RS256');
    expect(payload).toMatchObject({
      sub: ada.orcid, name: 'Ada Penhallow', given_name: 'Ada', family_name: 'Penhallow', email: ada.email, email_verified: true, nonce: 'n-0S6_WzA2Mj',
    });
    expect(payload.exp! - payload.iat!).toBe(600);
    const digest = createHash('sha256').update(tokens.body.access_token!).digest();
    expect(payload.at_hash).toBe(digest.subarray(0, 16).toString('base64url'));

    const info = await fetch(`${issuer}/userinfo`, { headers: { authorization: `Bearer ${tokens.body.access_token}` } });
    expect(await info.json()).toEqual({ sub: ada.orcid, name: 'Ada Penhallow', given_name: 'Ada', family_name: 'Penhallow', email: ada.email, email_verified: true });
  });

  it('refuses a wrong PKCE verifier, then accepts the right one once; a reused code revokes its access token', async () => {
    const { verifier, challenge } = pkce();
    const code = (await signInAs(wynn.orcid, challenge)).searchParams.get('code') ?? '';
    const base = { grant_type: 'authorization_code', code, redirect_uri: REDIRECT };
    const auth = { authorization: `Basic ${Buffer.from(`${CLIENT_ID}:${encodeURIComponent(CLIENT_SECRET)}`).toString('base64')}` };
    const wrong = await exchange({ ...base, code_verifier: pkce().verifier }, auth);
    expect(wrong).toMatchObject({ status: 400, body: { error: 'invalid_grant', error_description: 'PKCE verification failed' } });
    const none = await exchange(base, auth);
    expect(none.body.error).toBe('invalid_grant');

    const ok = await exchange({ ...base, code_verifier: verifier }, auth);
    expect(ok.status).toBe(200);
    const { payload } = await jwtVerify(ok.body.id_token!, createRemoteJWKSet(new URL(`${issuer}/jwks`)), { issuer, audience: CLIENT_ID });
    expect(payload.sub).toBe(wynn.orcid);
    expect(payload.email).toBeUndefined();
    expect(payload.nonce).toBeUndefined();

    const again = await exchange({ ...base, code_verifier: verifier }, auth);
    expect(again).toMatchObject({ status: 400, body: { error: 'invalid_grant', error_description: 'code already used' } });
    const info = await fetch(`${issuer}/userinfo`, { headers: { authorization: `Bearer ${ok.body.access_token}` } });
    expect(info.status).toBe(401);
  });

  it('refuses a bad client secret, a foreign redirect URI, a request without PKCE, and a forged signature', async () => {
    const { verifier, challenge } = pkce();
    const code = (await signInAs(ada.orcid, challenge)).searchParams.get('code') ?? '';
    const badClient = await exchange({ grant_type: 'authorization_code', code, redirect_uri: REDIRECT, code_verifier: verifier, client_id: CLIENT_ID, client_secret: 'guess' });
    expect(badClient).toMatchObject({ status: 401, body: { error: 'invalid_client' } });
    const otherRedirect = await exchange({ grant_type: 'authorization_code', code, redirect_uri: `${APP}/elsewhere`, code_verifier: verifier, client_id: CLIENT_ID, client_secret: CLIENT_SECRET });
    expect(otherRedirect.body.error_description).toBe('redirect_uri does not match the authorization request');

    const foreign = await fetch(authorizeUrl({ redirect_uri: 'http://attacker.invalid/cb', code_challenge: challenge, code_challenge_method: 'S256' }), { redirect: 'manual' });
    expect(foreign.status).toBe(400); // shown, never redirected (RFC 6749 §4.1.2.1)
    expect(foreign.headers.get('location')).toBeNull();

    const plain = await fetch(authorizeUrl({ state: 'st-2' }), { redirect: 'manual' });
    expect(plain.status).toBe(302);
    const to = new URL(plain.headers.get('location') ?? '');
    expect([to.searchParams.get('error'), to.searchParams.get('state')]).toEqual(['invalid_request', 'st-2']);

    const good = await exchange({ grant_type: 'authorization_code', code, redirect_uri: REDIRECT, code_verifier: verifier, client_id: CLIENT_ID, client_secret: CLIENT_SECRET });
    const [h, p, s] = good.body.id_token!.split('.');
    const claims = JSON.parse(Buffer.from(p!, 'base64url').toString()) as Record<string, unknown>;
    const forged = [h, Buffer.from(JSON.stringify({ ...claims, sub: wynn.orcid })).toString('base64url'), s].join('.');
    expect(decodeProtectedHeader(forged).alg).toBe('RS256');
    await expect(jwtVerify(forged, createRemoteJWKSet(new URL(`${issuer}/jwks`)), { issuer, audience: CLIENT_ID })).rejects.toThrow('signature verification failed');
  });

  it('sends access_denied back when the user cancels', async () => {
    const page = await fetch(authorizeUrl({ code_challenge: pkce().challenge, code_challenge_method: 'S256', state: 'st-3' }));
    const requestId = /name="request" value="([^"]+)"/.exec(await page.text())?.[1] ?? '';
    const res = await fetch(`${issuer}/authorize/decide`, {
      method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ request: requestId, deny: '1' }),
    });
    const to = new URL(res.headers.get('location') ?? '');
    expect([to.searchParams.get('error'), to.searchParams.get('state'), to.searchParams.get('code')]).toEqual(['access_denied', 'st-3', null]);
  });
});
