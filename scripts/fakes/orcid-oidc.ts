// Protocol core of the ORCID sign-in fake: authorization requests, codes and tokens (OpenID Connect Core 1.0,
// authorization code flow; RFC 6749 with PKCE S256 from RFC 7636). In memory: a restart signs everyone out.
import { createHash, randomBytes } from 'node:crypto';
import { calculateJwkThumbprint, exportJWK, generateKeyPair, SignJWT, type JWK, type KeyLike } from 'jose';
import { researcherByOrcid, type Researcher } from './orcid-researchers';

export type OidcClient = { clientId: string; clientSecret: string; redirectUris: string[] };
export type OidcError = { error: string; description: string };

type PendingRequest = { clientId: string; redirectUri: string; state?: string; nonce?: string; codeChallenge: string; createdAt: number };
type IssuedCode = { request: PendingRequest; orcid: string; createdAt: number; used: boolean; accessTokens: string[] };
type AccessToken = { orcid: string; expiresAt: number };

const REQUEST_TTL_MS = 10 * 60_000;
const CODE_TTL_MS = 60_000; // RFC 6749 §4.1.2: short-lived, single use
const TOKEN_TTL_S = 600;
const VERIFIER = /^[A-Za-z0-9\-._~]{43,128}$/; // RFC 7636 §4.1
const CHALLENGE = /^[A-Za-z0-9_-]{43}$/; // base64url of a SHA-256, no padding

const b64url = (buf: Buffer) => buf.toString('base64url');
const newId = () => b64url(randomBytes(24));
/** RFC 7636 §4.2: code_challenge = BASE64URL(SHA256(ASCII(code_verifier))). */
export const s256 = (verifier: string) => b64url(createHash('sha256').update(verifier, 'ascii').digest());
/** OIDC Core §3.1.3.6: at_hash is the left half of the SHA-256 of the access token, base64url. */
const atHash = (accessToken: string) => b64url(createHash('sha256').update(accessToken, 'ascii').digest().subarray(0, 16));

export class OrcidFakeProvider {
  private readonly pending = new Map<string, PendingRequest>();
  private readonly codes = new Map<string, IssuedCode>();
  private readonly tokens = new Map<string, AccessToken>();

  private constructor(readonly issuer: string, readonly client: OidcClient, private readonly key: KeyLike, readonly publicJwk: JWK) {}

  /** A provider with a fresh RS256 key pair (2048-bit), generated at start and never written to disk. */
  static async create(issuer: string, client: OidcClient): Promise<OrcidFakeProvider> {
    const { privateKey, publicKey } = await generateKeyPair('RS256', { modulusLength: 2048 });
    const jwk = await exportJWK(publicKey);
    const kid = await calculateJwkThumbprint(jwk);
    return new OrcidFakeProvider(issuer.replace(/\/$/, ''), client, privateKey, { ...jwk, kid, alg: 'RS256', use: 'sig' });
  }

  discovery() {
    const i = this.issuer;
    return {
      issuer: i, authorization_endpoint: `${i}/authorize`, token_endpoint: `${i}/token`, userinfo_endpoint: `${i}/userinfo`, jwks_uri: `${i}/jwks`,
      response_types_supported: ['code'], grant_types_supported: ['authorization_code'], subject_types_supported: ['public'],
      id_token_signing_alg_values_supported: ['RS256'], scopes_supported: ['openid'], code_challenge_methods_supported: ['S256'],
      token_endpoint_auth_methods_supported: ['client_secret_post', 'client_secret_basic'],
      claims_supported: ['sub', 'iss', 'aud', 'exp', 'iat', 'auth_time', 'nonce', 'at_hash', 'name', 'given_name', 'family_name', 'email', 'email_verified'],
      authorization_response_iss_parameter_supported: true,
    };
  }

  /**
   * Checks an authorization request. Unknown client or redirect URI: an error shown on the page, never a redirect
   * (RFC 6749 §4.1.2.1). Other problems are sent back to the client's redirect URI.
   */
  startAuthorization(q: URLSearchParams): { requestId: string } | { page: string } | { redirect: string } {
    const clientId = q.get('client_id') ?? '';
    const redirectUri = q.get('redirect_uri') ?? '';
    if (clientId !== this.client.clientId) return { page: `Unknown client_id "${clientId}".` };
    if (!this.client.redirectUris.includes(redirectUri)) return { page: `redirect_uri "${redirectUri}" is not registered for this client.` };
    const state = q.get('state') ?? undefined;
    const back = (error: string, description: string) => ({ redirect: this.redirectWith(redirectUri, { error, error_description: description, state }) });
    if (q.get('response_type') !== 'code') return back('unsupported_response_type', 'only response_type=code is supported');
    if (!(q.get('scope') ?? '').split(' ').includes('openid')) return back('invalid_scope', 'scope must include openid');
    const codeChallenge = q.get('code_challenge') ?? '';
    if (q.get('code_challenge_method') !== 'S256' || !CHALLENGE.test(codeChallenge)) {
      return back('invalid_request', 'PKCE is required: code_challenge with code_challenge_method=S256');
    }
    this.sweep();
    const requestId = newId();
    this.pending.set(requestId, { clientId, redirectUri, state, nonce: q.get('nonce') ?? undefined, codeChallenge, createdAt: Date.now() });
    return { requestId };
  }

  /** The user picked a researcher (or cancelled): back to the client with a one-time code (or access_denied). */
  decide(requestId: string, orcid: string | null): { redirect: string } | { page: string } {
    const request = this.pending.get(requestId);
    this.pending.delete(requestId);
    if (!request || Date.now() - request.createdAt > REQUEST_TTL_MS) return { page: 'This sign-in request has expired or was already answered. Start again from the application.' };
    if (orcid === null) return { redirect: this.redirectWith(request.redirectUri, { error: 'access_denied', error_description: 'the user cancelled', state: request.state }) };
    if (!researcherByOrcid(orcid)) return { page: `No test researcher has the iD ${orcid}.` };
    const code = newId();
    this.codes.set(code, { request, orcid, createdAt: Date.now(), used: false, accessTokens: [] });
    return { redirect: this.redirectWith(request.redirectUri, { code, state: request.state }) };
  }

  /** Exchanges a code for tokens after checking the client, the redirect URI and the PKCE verifier. */
  async exchangeCode(form: URLSearchParams, basicAuth: { id: string; secret: string } | null): Promise<{ status: number; body: object }> {
    const id = basicAuth?.id ?? form.get('client_id') ?? '';
    const secret = basicAuth?.secret ?? form.get('client_secret') ?? '';
    if (id !== this.client.clientId || secret !== this.client.clientSecret) return fail(401, 'invalid_client', 'client authentication failed');
    if (form.get('grant_type') !== 'authorization_code') return fail(400, 'unsupported_grant_type', 'only authorization_code is supported');
    const code = this.codes.get(form.get('code') ?? '');
    if (!code || code.request.clientId !== id || Date.now() - code.createdAt > CODE_TTL_MS) return fail(400, 'invalid_grant', 'unknown or expired code');
    if (code.used) {
      // RFC 6749 §4.1.2: a reused code revokes what it was exchanged for.
      for (const t of code.accessTokens) this.tokens.delete(t);
      return fail(400, 'invalid_grant', 'code already used');
    }
    if ((form.get('redirect_uri') ?? '') !== code.request.redirectUri) return fail(400, 'invalid_grant', 'redirect_uri does not match the authorization request');
    const verifier = form.get('code_verifier') ?? '';
    if (!VERIFIER.test(verifier) || s256(verifier) !== code.request.codeChallenge) return fail(400, 'invalid_grant', 'PKCE verification failed');
    code.used = true;
    const researcher = researcherByOrcid(code.orcid)!;
    const accessToken = newId();
    code.accessTokens.push(accessToken);
    this.tokens.set(accessToken, { orcid: researcher.orcid, expiresAt: Date.now() + TOKEN_TTL_S * 1000 });
    const idToken = await new SignJWT({
      ...claimsOf(researcher), auth_time: Math.floor(code.createdAt / 1000), at_hash: atHash(accessToken),
      ...(code.request.nonce ? { nonce: code.request.nonce } : {}),
    })
      .setProtectedHeader({ alg: 'RS256', kid: this.publicJwk.kid, typ: 'JWT' })
      .setIssuer(this.issuer).setAudience(id).setSubject(researcher.orcid).setIssuedAt().setExpirationTime(`${TOKEN_TTL_S}s`)
      .sign(this.key);
    const name = `${researcher.givenName} ${researcher.familyName}`;
    return { status: 200, body: { access_token: accessToken, token_type: 'bearer', expires_in: TOKEN_TTL_S, scope: 'openid', id_token: idToken, name, orcid: researcher.orcid } };
  }

  userinfo(accessToken: string): object | null {
    const t = this.tokens.get(accessToken);
    if (!t || t.expiresAt < Date.now()) return null;
    return { sub: t.orcid, ...claimsOf(researcherByOrcid(t.orcid)!) };
  }

  private redirectWith(uri: string, params: Record<string, string | undefined>): string {
    const url = new URL(uri);
    for (const [k, v] of Object.entries({ ...params, iss: this.issuer })) if (v !== undefined) url.searchParams.set(k, v);
    return url.toString();
  }

  private sweep(): void {
    const now = Date.now();
    for (const [k, r] of this.pending) if (now - r.createdAt > REQUEST_TTL_MS) this.pending.delete(k);
    for (const [k, c] of this.codes) if (now - c.createdAt > REQUEST_TTL_MS) this.codes.delete(k);
    for (const [k, t] of this.tokens) if (t.expiresAt < now) this.tokens.delete(k);
  }
}

function claimsOf(r: Researcher) {
  return {
    name: `${r.givenName} ${r.familyName}`, given_name: r.givenName, family_name: r.familyName,
    ...(r.email ? { email: r.email, email_verified: r.emailVerified } : {}),
  };
}

function fail(status: number, error: string, description: string): { status: number; body: object } {
  return { status, body: { error, error_description: description } };
}
