// startStack: MariaDB, s3rver, the SMTP, DOI and ORCID fakes for one profile, started together, then the worker;
// stopped in order.
import { mkdirSync, rmSync } from 'node:fs';
import { buildEnv, DATABASE_NAME, S3_BUCKET, type StackEnv } from './env';
import { type DataLayout, type Profile, profileLayout, rel } from './layout';
import { startMariaDb } from './mariadb';
import { startNodeService } from './node-service';
import { acquireRunnerLock, removePid, stopLeftovers } from './pidfiles';
import { assertPortsFree, type Ports, resolvePorts } from './ports';
import { type Service, ServiceStartError, tailFile, terminateGroupNow } from './proc';
import { appOrigins } from './s3-cors';
import { loadOrCreateSecrets } from './secrets';

export type Stack = {
  profile: Profile;
  layout: DataLayout;
  ports: Ports;
  env: StackEnv;
  services: Service[];
  /** Hands a process started later (the app server) to the stack, so stop() ends it first. */
  adopt(service: Service): void;
  stop(): Promise<void>;
};

export type StackOptions = {
  /** How the user re-runs this, for messages (`npm start`). */
  command: string;
  /** The runner script, recorded in the lock so a recycled pid is not mistaken for it. */
  script: string;
  wipe?: boolean;
  log?: (line: string) => void;
};

export class StackStartError extends Error {}

export function describeStartError(error: ServiceStartError): string {
  const lines = [`✗ ${error.service} did not start: ${error.reason}`];
  if (error.logFile) lines.push(`--- last lines of ${rel(error.logFile)} ---`, tailFile(error.logFile, 20), '---');
  return lines.join('\n');
}

const live = new Set<Service>();
// If the runner dies without stop(), do not leave servers behind; SIGTERM is a clean shutdown for each of them.
process.once('exit', () => {
  for (const s of live) if (s.alive()) terminateGroupNow(s.pid);
});

async function timed(name: string, detail: string, log: (l: string) => void, start: () => Promise<Service>): Promise<Service> {
  const t = Date.now();
  const s = await start();
  live.add(s);
  log(`${name} ready ${detail} (${((Date.now() - t) / 1000).toFixed(1)} s)`);
  return s;
}

export async function startStack(profile: Profile, opts: StackOptions): Promise<Stack> {
  const log = opts.log ?? ((l: string) => console.log(l));
  const layout = profileLayout(profile);
  acquireRunnerLock(layout, opts.script);
  await stopLeftovers(layout, log);
  if (opts.wipe) rmSync(layout.dir, { recursive: true, force: true });
  for (const dir of [layout.logs, layout.run, layout.s3, layout.mail, layout.doi, layout.reports]) mkdirSync(dir, { recursive: true });
  acquireRunnerLock(layout, opts.script);

  const ports = resolvePorts(profile);
  await assertPortsFree(ports, opts.command);
  const secrets = loadOrCreateSecrets(layout.secrets);
  const env = buildEnv(profile, ports, layout, secrets);
  log(`starting services for ${profile} in ${rel(layout.dir)}/ (logs in ${rel(layout.logs)}/)`);

  const fake = (name: string, script: string, extra: Record<string, string>) => () =>
    startNodeService({ layout, name, script, env: { ...env, ...extra } });
  const attempts = await Promise.allSettled([
    timed('mariadb', `on 127.0.0.1:${ports.DB_PORT}, database ${DATABASE_NAME[profile]}`, log, () =>
      startMariaDb({ layout, port: ports.DB_PORT, database: DATABASE_NAME[profile], log })),
    timed('s3rver', `on ${env.S3_ENDPOINT}, bucket ${S3_BUCKET}`, log, fake('s3rver', 'scripts/stack/s3rver-process.ts', {
      S3_DIR: layout.s3, S3_CORS_ORIGINS: appOrigins(ports.PORT).join(','),
    })),
    timed('smtp', `on ${env.SMTP_URL}`, log, fake('smtp', 'scripts/fakes/smtp-fake.ts', {})),
    timed('doi', `on ${env.DOI_API_URL}`, log, fake('doi', 'scripts/fakes/doi-fake.ts', { DOI_DIR: layout.doi })),
    timed('orcid', `on ${env.ORCID_ISSUER}`, log, fake('orcid', 'scripts/fakes/orcid-fake.ts', {})),
  ]);
  const services = attempts.flatMap((a) => (a.status === 'fulfilled' ? [a.value] : []));
  const failures = attempts.flatMap((a) => (a.status === 'rejected' ? [a.reason as unknown] : []));
  // The worker (analysis, outbox, upload cleanup) needs the database and storage, so it starts once they are up.
  // It tolerates tables that the runner migrates only after startStack returns: it retries, logging once a minute.
  if (failures.length === 0) {
    try {
      services.push(
        await timed('worker', '(file analysis, outbox, upload cleanup)', log, fake('worker', 'scripts/worker.ts', {
          // 'server-only' resolves to its empty module under the react-server condition, as inside Next.
          NODE_OPTIONS: [process.env.NODE_OPTIONS, '--conditions=react-server'].filter(Boolean).join(' '),
        })),
      );
    } catch (error) {
      failures.push(error);
    }
  }
  const adopted: Service[] = [];
  let stopping: Promise<void> | undefined;

  const stop = () =>
    (stopping ??= (async () => {
      for (const s of adopted.reverse()) await s.stop().finally(() => live.delete(s));
      const db = services.filter((s) => s.name === 'mariadb');
      await Promise.all(services.filter((s) => s.name !== 'mariadb').map((s) => s.stop().finally(() => live.delete(s))));
      for (const s of db) await s.stop().finally(() => live.delete(s));
      removePid(layout, 'runner');
    })());

  if (failures.length) {
    await stop();
    const text = failures.map((f) => (f instanceof ServiceStartError ? describeStartError(f) : `✗ ${String(f)}`)).join('\n\n');
    throw new StackStartError(`${text}\n\nEverything that had started was stopped.`);
  }
  return {
    profile, layout, ports, env, services,
    adopt(service) {
      adopted.push(service);
      live.add(service);
    },
    stop,
  };
}

