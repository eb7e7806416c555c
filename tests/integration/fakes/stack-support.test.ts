// The runner's own pieces: port clash message, totals line, vitest report counting, s3rver CORS, DOI fake persistence.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { RESOURCE_TYPE_GENERAL } from '@/scripts/fakes/doi-model';
import { dataLayout } from '@/scripts/stack/layout';
import { startNodeService } from '@/scripts/stack/node-service';
import { ConfigError, assertPortFree, portTakenMessage, probePort, resolvePorts } from '@/scripts/stack/ports';
import { countVitest, stepResult, totalsLine } from '@/scripts/stack/totals';
import { assertLoopback, requireEnv } from '@/tests/support/services';

function listenOnFreePort(): Promise<net.Server> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.listen(0, '127.0.0.1', () => resolve(server));
  });
}
const portOf = (s: net.Server) => (s.address() as net.AddressInfo).port;

describe('port checks', () => {
  it('names the variable to change when a port is taken', async () => {
    const blocker = await listenOnFreePort();
    const port = portOf(blocker);
    try {
      expect(await probePort(port)).toBe('EADDRINUSE');
      const error = await assertPortFree('DB_PORT', port, 'npm start').catch((e: unknown) => e);
      expect(error).toBeInstanceOf(ConfigError);
      expect((error as Error).message).toBe(portTakenMessage('DB_PORT', port, 'npm start'));
      expect((error as Error).message).toContain(`Port ${port} on 127.0.0.1 is already in use, so MariaDB cannot start.`);
      expect((error as Error).message).toContain(`DB_PORT=${port + 1} npm start`);
    } finally {
      blocker.close();
    }
    await new Promise((r) => setTimeout(r, 50));
    expect(await probePort(port)).toBeNull();
  });

  it('takes overrides from the environment and rejects bad or duplicate ports', () => {
    expect(resolvePorts('test', {})).toEqual({ PORT: 3101, DB_PORT: 3317, S3_PORT: 4578, SMTP_PORT: 2535, DOI_PORT: 4620, ORCID_PORT: 4640 });
    expect(resolvePorts('dev', { DB_PORT: '3399' }).DB_PORT).toBe(3399);
    expect(() => resolvePorts('dev', { SMTP_PORT: 'abc' })).toThrow('SMTP_PORT=abc is not a TCP port');
    expect(() => resolvePorts('dev', { DOI_PORT: '3307' })).toThrow('DB_PORT and DOI_PORT are both 3307');
  });
});

describe('totals', () => {
  it('prints "N passed, N failed" and adds skipped only when there are some', () => {
    const lint = stepResult('lint', true, 1);
    const typecheck = stepResult('typecheck', false, 2);
    expect(totalsLine([lint, typecheck])).toBe('1 passed, 1 failed');
    expect(totalsLine([lint, { name: 'vitest', passed: 40, failed: 0, skipped: 3, seconds: 9 }])).toBe('41 passed, 0 failed, 3 skipped');
    expect(totalsLine([])).toBe('0 passed, 0 failed');
  });

  it('counts a vitest JSON report, a file that failed to load, and a missing report', () => {
    const report = {
      numPassedTests: 7, numFailedTests: 2, numPendingTests: 1, numTodoTests: 0,
      testResults: [{ status: 'failed', assertionResults: [] }, { status: 'passed', assertionResults: [{}, {}] }],
    };
    expect(countVitest('vitest', report, 1, 3)).toMatchObject({ passed: 7, failed: 3, skipped: 1 });
    expect(countVitest('vitest', { numPassedTests: 4, numFailedTests: 0, testResults: [] }, 1, 3)).toMatchObject({ passed: 4, failed: 1 });
    expect(countVitest('e2e', undefined, 137, 3)).toMatchObject({ passed: 0, failed: 1, note: 'no report (exit code 137)' });
  });
});

describe('s3rver bucket CORS', () => {
  const s3 = assertLoopback(requireEnv('S3_ENDPOINT'), 'object storage').origin;
  const bucket = requireEnv('S3_BUCKET');
  const preflight = (origin: string, method: string) =>
    fetch(`${s3}/${bucket}/probe.txt`, {
      method: 'OPTIONS',
      headers: { Origin: origin, 'Access-Control-Request-Method': method, 'Access-Control-Request-Headers': 'content-type' },
    });

  it("allows the app's origin to PUT and GET, and refuses other origins and methods", async () => {
    const app = requireEnv('NEXTAUTH_URL');
    const put = await preflight(app, 'PUT');
    expect(put.status).toBe(200);
    expect(put.headers.get('access-control-allow-methods')).toBe('GET, PUT, HEAD');
    expect(put.headers.get('access-control-allow-headers')).toBe('content-type');
    expect((await preflight(app.replace('localhost', '127.0.0.1'), 'GET')).status).toBe(200);
    expect((await preflight('http://elsewhere.test', 'PUT')).status).toBe(403);
    expect((await preflight(app, 'DELETE')).status).toBe(403);
  });
});

describe('DOI fake', () => {
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'ohmstead-doi-'));
  afterAll(() => rmSync(tmp, { recursive: true, force: true }));

  it('keeps its DOIs across a restart', async () => {
    const probe = await listenOnFreePort();
    const port = portOf(probe);
    await new Promise((r) => probe.close(r));
    const layout = dataLayout(tmp);
    const env = { DOI_PORT: String(port), DOI_DIR: layout.doi, DOI_REPOSITORY_ID: 'OHM.HUB', DOI_PASSWORD: 'restart-check', DOI_PREFIX: '10.80123' };
    const auth = `Basic ${Buffer.from('OHM.HUB:restart-check').toString('base64')}`;
    const url = `http://127.0.0.1:${port}/dois`;

    const first = await startNodeService({ layout, name: 'doi', script: 'scripts/fakes/doi-fake.ts', env });
    const created = await fetch(url, { method: 'POST', headers: { Authorization: auth }, body: JSON.stringify({ data: { type: 'dois', attributes: { doi: '10.80123/restart-1' } } }) });
    expect(created.status).toBe(201);
    await first.stop();
    expect(first.alive()).toBe(false);

    const second = await startNodeService({ layout, name: 'doi', script: 'scripts/fakes/doi-fake.ts', env });
    try {
      const read = await fetch(`${url}/10.80123%2Frestart-1`, { headers: { Authorization: auth } });
      expect(read.status).toBe(200);
      expect(((await read.json()) as { data: { attributes: { state: string } } }).data.attributes.state).toBe('draft');
    } finally {
      await second.stop();
    }
  });

  it('knows exactly the resourceTypeGeneral values of DataCite 4.7', () => {
    // Oracle: DataCite Metadata Schema 4.7, include/datacite-resourceType-v4.xsd.
    const xsd = readFileSync(path.resolve('..', 'shared', 'oracles', 'datacite-kernel-4.7', 'include', 'datacite-resourceType-v4.xsd'), 'utf8');
    const values = [...xsd.matchAll(/<xs:enumeration value="([^"]+)"/g)].map((m) => m[1]);
    expect(values.length).toBeGreaterThan(30);
    expect([...RESOURCE_TYPE_GENERAL]).toEqual(values);
  });
});
