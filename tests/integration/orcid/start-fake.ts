// Starts scripts/fakes/orcid-fake.ts as scripts/stack does (tsx child, ready message), on a free loopback port.
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { dataLayout } from '@/scripts/stack/layout';
import { startNodeService } from '@/scripts/stack/node-service';

export type RunningFake = { issuer: string; clientId: string; clientSecret: string; appUrl: string; redirectUri: string; stop(): Promise<void> };

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((r) => server.close(r));
  return port;
}

export async function startOrcidFake(opts: { clientId: string; clientSecret: string; appUrl: string }): Promise<RunningFake> {
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'ohmstead-orcid-'));
  const port = await freePort();
  const issuer = `http://127.0.0.1:${port}`;
  const service = await startNodeService({
    layout: dataLayout(tmp), name: 'orcid', script: 'scripts/fakes/orcid-fake.ts',
    env: { ORCID_PORT: String(port), ORCID_ISSUER: issuer, ORCID_CLIENT_ID: opts.clientId, ORCID_CLIENT_SECRET: opts.clientSecret, NEXTAUTH_URL: opts.appUrl },
  });
  return {
    issuer, ...opts, redirectUri: `${opts.appUrl}/api/auth/callback/orcid`,
    async stop() {
      await service.stop();
      rmSync(tmp, { recursive: true, force: true });
    },
  };
}

/** What the browser does on the fake's page: open the authorization URL and press "Sign in as …" for one iD. */
export async function chooseResearcher(authorizationUrl: string, orcid: string): Promise<string> {
  const page = await fetch(authorizationUrl, { redirect: 'manual' });
  if (page.status !== 200) throw new Error(`authorize answered ${page.status}: ${page.headers.get('location') ?? await page.text()}`);
  const html = await page.text();
  const requestId = /name="request" value="([^"]+)"/.exec(html)?.[1] ?? '';
  const issuer = new URL(authorizationUrl).origin;
  const decided = await fetch(`${issuer}/authorize/decide`, {
    method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ request: requestId, orcid }),
  });
  return decided.headers.get('location') ?? '';
}
