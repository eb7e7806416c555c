// `npm start`: services (dev profile, .data/) → migrations and, on first run, the demo seed → build if sources changed → serve.
import { existsSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages } from './stack/apt';
import { writeEnvFile } from './stack/env-file';
import { demoAccountLines, migrate } from './stack/app-setup';
import { handleSignals, interruptedBy, seconds } from './stack/foreground';
import { type Stack, StackStartError, describeStartError, startStack } from './stack/index';
import { rel } from './stack/layout';
import { buildApp, buildIsCurrent, startApp } from './stack/next-app';
import { ConfigError } from './stack/ports';
import { ServiceStartError, tailFile } from './stack/proc';

const started = Date.now();
let stack: Stack | undefined;

async function finish(code: number): Promise<never> {
  if (stack) {
    const t = Date.now();
    await stack.stop();
    console.log(`stopped app, s3rver, SMTP fake, DOI fake and MariaDB (${seconds(t)} s); data kept in ${rel(stack.layout.dir)}/`);
  }
  process.exit(code);
}

// A requested stop is a normal end for a server; exit 0 so npm does not report an error.
handleSignals(() => {
  if (stack) void finish(0);
});

async function main(): Promise<void> {
  await ensureDebianPackages(['mariadb-server']);
  stack = await startStack('dev', { command: 'npm start', script: 'scripts/start.ts' });
  if (interruptedBy()) return finish(0);

  const seedStamp = path.join(stack.layout.dir, 'seeded.json');
  // Seed once per data dir: re-running a demo seed on every start would overwrite what the user did.
  const firstRun = !existsSync(seedStamp);
  const m = await migrate(stack, firstRun);
  if (interruptedBy()) return finish(0);
  if (m.missing) console.warn(`! ${m.note}; the app will start without a schema.`);
  else if (!m.ok) {
    console.error(`✗ migrations failed (${m.note}); see the output above.`);
    return finish(1);
  } else if (firstRun) writeFileSync(seedStamp, JSON.stringify({ seededAt: new Date().toISOString() }) + '\n');
  // The settings for scripts run by hand against this stack (bench fixture, bench:load, reindex), ports included.
  const envFile = writeEnvFile(stack);

  if (buildIsCurrent(stack)) console.log('build: sources unchanged since the last `npm start` build, reusing .next/');
  else {
    console.log('build: sources changed (or no build yet): next build');
    const b = await buildApp(stack);
    if (interruptedBy()) return finish(0);
    if (b.code !== 0) {
      console.error(`✗ next build failed (exit code ${b.code}); see the output above.`);
      return finish(1);
    }
    console.log(`build: done in ${b.seconds.toFixed(1)} s`);
  }

  const app = await startApp(stack, { tee: process.stdout });
  const url = stack.env.NEXTAUTH_URL;
  console.log(
    [
      '',
      `Ohmstead is running at ${url}   (ready in ${seconds(started)} s)`,
      '',
      ...demoAccountLines(),
      '',
      `Mail: nothing leaves this machine; messages land in ${rel(stack.env.MAIL_DIR)}/ — read them at ${url}/dev/mailbox`,
      `Logs: ${rel(stack.layout.logs)}/   Data: ${rel(stack.layout.dir)}/ (kept between runs; wipe with npm run reset)`,
      `Settings for scripts run by hand: set -a; . ${rel(envFile)}; set +a`,
      'Stop: Ctrl-C',
      '',
    ].join('\n'),
  );
  const exit = await app.exited;
  if (interruptedBy()) return;
  console.error(`✗ the app server exited unexpectedly (${exit.signal ?? `code ${exit.code}`}); last lines of ${rel(app.logFile)}:`);
  console.error(tailFile(app.logFile, 20));
  return finish(1);
}

main().catch((error: unknown) => {
  if (interruptedBy()) return void finish(0);
  if (error instanceof StackStartError || error instanceof ConfigError) console.error(error.message);
  else if (error instanceof ServiceStartError) console.error(describeStartError(error));
  else console.error('npm start failed:', error);
  void finish(1);
});
