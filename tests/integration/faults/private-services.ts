// Private service instances for the fault tests: each on a free loopback port in its own temp dir, started with the
// project's own starters (scripts/stack), so a test can stop and restart them without touching the shared services.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { type DataLayout, dataLayout } from '@/scripts/stack/layout';
import { startMariaDb } from '@/scripts/stack/mariadb';
import { startNodeService } from '@/scripts/stack/node-service';
import type { Service } from '@/scripts/stack/proc';

/** A free loopback port: one the OS just gave out and took back. */
export async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

/** One private service: start() and stop() may be called again; the port and data dir stay the same. */
export type PrivateService = {
  port: number;
  layout: DataLayout;
  running(): boolean;
  start(): Promise<void>;
  stop(): Promise<void>;
  /** Stops the service and removes its temp dir; safe to call twice. */
  dispose(): Promise<void>;
};

function privateService(name: string, port: number, starter: (layout: DataLayout) => Promise<Service>): PrivateService {
  const layout = dataLayout(mkdtempSync(path.join(os.tmpdir(), `ohmstead-fault-${name}-`)));
  for (const dir of [layout.logs, layout.run, layout.s3, layout.mail, layout.doi]) mkdirSync(dir, { recursive: true });
  let current: Service | undefined;
  const stop = async () => {
    const s = current;
    current = undefined;
    if (s) await s.stop();
  };
  return {
    port,
    layout,
    running: () => current?.alive() ?? false,
    async start() {
      if (current?.alive()) return;
      current = await starter(layout);
    },
    stop,
    async dispose() {
      await stop();
      rmSync(layout.dir, { recursive: true, force: true });
    },
  };
}

const env = (name: string): string => {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: source .data/env.sh first (npm run services writes it)`);
  return value;
};

/** s3rver with the app's bucket (S3_BUCKET), data kept across restarts in the temp dir. */
export async function privateS3rver(): Promise<PrivateService & { endpoint: string }> {
  const port = await freePort();
  const s = privateService('s3rver', port, (layout) =>
    startNodeService({
      layout, name: 's3rver', script: 'scripts/stack/s3rver-process.ts',
      env: { S3_PORT: String(port), S3_DIR: layout.s3, S3_BUCKET: env('S3_BUCKET'), S3_CORS_ORIGINS: 'http://localhost:3000' },
    }));
  return Object.assign(s, { endpoint: `http://127.0.0.1:${port}` });
}

/** The DOI fake with the app's repository id, password and prefix; DOIs persist in the temp dir across restarts. */
export async function privateDoiFake(): Promise<PrivateService & { apiUrl: string }> {
  const port = await freePort();
  const s = privateService('doi', port, (layout) =>
    startNodeService({
      layout, name: 'doi', script: 'scripts/fakes/doi-fake.ts',
      env: {
        DOI_PORT: String(port), DOI_DIR: layout.doi, DOI_REPOSITORY_ID: env('DOI_REPOSITORY_ID'), DOI_PASSWORD: env('DOI_PASSWORD'),
        DOI_PREFIX: env('DOI_PREFIX'),
      },
    }));
  return Object.assign(s, { apiUrl: `http://127.0.0.1:${port}` });
}

/** The SMTP fake; every accepted message lands as <id>.json in layout.mail. */
export async function privateSmtpFake(): Promise<PrivateService & { smtpUrl: string }> {
  const port = await freePort();
  const s = privateService('smtp', port, (layout) =>
    startNodeService({ layout, name: 'smtp', script: 'scripts/fakes/smtp-fake.ts', env: { SMTP_PORT: String(port), MAIL_DIR: layout.mail } }));
  return Object.assign(s, { smtpUrl: `smtp://127.0.0.1:${port}` });
}

/** A MariaDB server with database `faults`; the datadir survives restarts. */
export async function privateMariaDb(): Promise<PrivateService & { databaseUrl: string }> {
  const port = await freePort();
  const s = privateService('mariadb', port, (layout) => startMariaDb({ layout, port, database: 'faults', log: () => {} }));
  return Object.assign(s, { databaseUrl: `mysql://root@127.0.0.1:${port}/faults` });
}
