import 'server-only';
import type { OAuthConfig } from 'next-auth/providers/oauth';
import { env } from '@/lib/env';
import { canonicalOrcid, type OrcidClaims } from '@/lib/users/link-orcid-account';

/** The id_token claims we read (OpenID Connect Core §5.1); ORCID sends the iD as `sub`. */
export type OrcidIdToken = {
  sub: string;
  name?: string;
  given_name?: string;
  family_name?: string;
  email?: string;
  email_verified?: boolean;
};

export const ORCID_PROVIDER_ID = 'orcid';

export function orcidConfigured(): boolean {
  const e = env();
  return Boolean(e.ORCID_ISSUER && e.ORCID_CLIENT_ID && e.ORCID_CLIENT_SECRET);
}

export function claimsFromIdToken(p: OrcidIdToken): OrcidClaims {
  return {
    sub: p.sub, name: p.name ?? null, givenName: p.given_name ?? null, familyName: p.family_name ?? null,
    email: p.email ?? null, emailVerified: p.email_verified === true,
  };
}

/**
 * Sign in with ORCID: OpenID Connect discovery at ORCID_ISSUER (https://orcid.org, or the local fake), the
 * authorization code flow with PKCE and state, the id_token checked against the issuer's keys. Null when unset.
 */
export function orcidProvider(): OAuthConfig<OrcidIdToken> | null {
  const { ORCID_ISSUER, ORCID_CLIENT_ID, ORCID_CLIENT_SECRET } = env();
  if (!ORCID_ISSUER || !ORCID_CLIENT_ID || !ORCID_CLIENT_SECRET) return null;
  const issuer = ORCID_ISSUER.replace(/\/$/, '');
  return {
    id: ORCID_PROVIDER_ID,
    name: 'ORCID',
    type: 'oauth',
    wellKnown: `${issuer}/.well-known/openid-configuration`,
    issuer,
    clientId: ORCID_CLIENT_ID,
    clientSecret: ORCID_CLIENT_SECRET,
    // ORCID's token endpoint takes the client credentials in the form body.
    client: { token_endpoint_auth_method: 'client_secret_post' },
    authorization: { params: { scope: 'openid' } },
    idToken: true,
    checks: ['pkce', 'state'],
    profile(p) {
      const name = p.name || [p.given_name, p.family_name].filter(Boolean).join(' ') || p.sub;
      // The same form the link step stores, so next-auth finds the account it made.
      return { id: canonicalOrcid(p.sub), name, email: p.email_verified ? (p.email ?? null) : null };
    },
  };
}
