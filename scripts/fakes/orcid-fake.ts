// Local ORCID sign-in fake: an OpenID Connect provider with invented researchers, on loopback only. Keys and
// sessions live in memory; a restart makes a new signing key (clients refetch /jwks).
import http from 'node:http';
import { announceReady, onStop, setting } from './lifecycle';
import { OrcidFakeProvider } from './orcid-oidc';
import { RESEARCHERS } from './orcid-researchers';
import { createOrcidHandler } from './orcid-server';

const port = Number(setting('ORCID_PORT'));
const issuer = setting('ORCID_ISSUER');
const appUrl = setting('NEXTAUTH_URL').replace(/\/$/, '');

const provider = await OrcidFakeProvider.create(issuer, {
  clientId: setting('ORCID_CLIENT_ID'),
  clientSecret: setting('ORCID_CLIENT_SECRET'),
  // next-auth's callback path for the provider id "orcid".
  redirectUris: [`${appUrl}/api/auth/callback/orcid`],
});
const server = http.createServer(createOrcidHandler(provider));

server.once('error', (error) => {
  console.error('ORCID fake failed:', error.message);
  process.exit(1);
});
onStop(
  () =>
    new Promise<void>((resolve) => {
      server.close(() => resolve());
      server.closeAllConnections();
    }),
);
server.listen(port, '127.0.0.1', () => announceReady(`ORCID sign-in fake listening on ${issuer} (${RESEARCHERS.length} test researchers)`));
