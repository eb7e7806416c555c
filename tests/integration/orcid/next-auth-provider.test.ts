// Our next-auth ORCID provider, as next-auth uses it (next-auth/core/lib/oauth/client.js and callback.js: openid-client
// 5 discovery, a client built from the provider's fields, callback() with the state and PKCE checks), against the
// fake; then the sign-in callback's link step and the adapter look-up that next-auth does next, against MariaDB.
import { randomBytes } from 'node:crypto';
import { generators, Issuer } from 'openid-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexAdapter } from '@/lib/auth/repo-adapter';
import { db } from '@/lib/db';
import { RESEARCHERS } from '@/scripts/fakes/orcid-researchers';
import { chooseResearcher, startOrcidFake, type RunningFake } from './start-fake';

let fake: RunningFake;
let createdUserId: string | undefined;
const wynn = RESEARCHERS.find((r) => r.email === null)!;

beforeAll(async () => {
  fake = await startOrcidFake({ clientId: 'APP-OHMSTEAD-PROVIDER-TEST', clientSecret: randomBytes(18).toString('base64url'), appUrl: 'http://localhost:3998' });
  // lib/env reads these on first use in this file (each test file has its own module registry).
  process.env.ORCID_ISSUER = fake.issuer;
  process.env.ORCID_CLIENT_ID = fake.clientId;
  process.env.ORCID_CLIENT_SECRET = fake.clientSecret;
});
afterAll(async () => {
  // Only a user this test opened is removed (a developer may have signed in as this researcher on purpose).
  if (createdUserId) {
    await db()('audit_log').where({ actor_user_id: createdUserId }).delete();
    await db()('users').where({ id: createdUserId }).delete();
  }
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
  await fake?.stop();
});

describe('the next-auth ORCID provider against the local fake', () => {
  it('completes the code flow with PKCE and state, validates the id_token, and signs the researcher in', async () => {
    const { orcidProvider, claimsFromIdToken } = await import('@/lib/auth/orcid-provider');
    const { linkOrcidSignIn } = await import('@/lib/users/link-orcid-account');
    const provider = orcidProvider()!;
    expect(provider).toMatchObject({ id: 'orcid', type: 'oauth', idToken: true, checks: ['pkce', 'state'], wellKnown: `${fake.issuer}/.well-known/openid-configuration` });

    const issuer = await Issuer.discover(provider.wellKnown!);
    const client = new issuer.Client({ client_id: provider.clientId!, client_secret: provider.clientSecret, redirect_uris: [fake.redirectUri], ...provider.client });
    const verifier = generators.codeVerifier();
    const state = generators.state();
    const authParams = (provider.authorization as { params: Record<string, string> }).params;
    const url = client.authorizationUrl({ ...authParams, code_challenge: generators.codeChallenge(verifier), code_challenge_method: 'S256', state });
    const back = await chooseResearcher(url, wynn.orcid);

    const params = client.callbackParams(back);
    // A wrong verifier is refused by the fake; a wrong state by the client before any request.
    await expect(client.callback(fake.redirectUri, params, { code_verifier: generators.codeVerifier(), state })).rejects.toThrow('invalid_grant');
    await expect(client.callback(fake.redirectUri, params, { code_verifier: verifier, state: 'other' })).rejects.toThrow('state mismatch');
    const tokens = await client.callback(fake.redirectUri, params, { code_verifier: verifier, state });
    const claims = tokens.claims();
    expect(claims).toMatchObject({ iss: fake.issuer, aud: fake.clientId, sub: wynn.orcid, name: 'Wynn Harrowgate' });

    const profile = await provider.profile(claims as never, tokens);
    expect(profile).toEqual({ id: wynn.orcid, name: 'Wynn Harrowgate', email: null });
    const linked = await linkOrcidSignIn(claimsFromIdToken(claims as never));
    if (linked.outcome === 'created') createdUserId = linked.userId;
    const user = await knexAdapter().getUserByAccount!({ provider: provider.id, providerAccountId: profile.id as string });
    expect(user?.id).toBe(linked.userId);
    expect((await db()('users').where({ id: linked.userId }).first('orcid')).orcid).toBe(wynn.orcid);
  });
});
