// `npm run services`: the dev services only (MariaDB, s3rver, SMTP fake, DOI fake), migrated and seeded once, with
// their settings written to <data dir>/env.sh so that `set -a; . .data/env.sh; npx vitest run FILE` (or `npm run dev`)
// works against them. Stops everything on Ctrl-C.
import { existsSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages } from './stack/apt';
import { migrate } from './stack/app-setup';
import { handleSignals, interruptedBy, seconds } from './stack/foreground';
import { type Stack, StackStartError, describeStartError, startStack } from './stack/index';
import { writeEnvFile } from './stack/env-file';
import { rel } from './stack/layout';
import { ServiceStartError } from './stack/proc';

const started = Date.now();
let stack: Stack | undefined;

async function finish(code: number): Promise<never> {
  if (stack) await stack.stop();
  process.exit(code);
}

handleSignals(() => void finish(0));

async function main(): Promise<void> {
  await ensureDebianPackages(['mariadb-server']);
  stack = await startStack('dev', { command: 'npm run services', script: 'scripts/services.ts' });
  if (interruptedBy()) return finish(0);
  const seedStamp = path.join(stack.layout.dir, 'seeded.json');
  const firstRun = !existsSync(seedStamp);
  const m = await migrate(stack, firstRun);
  if (!m.ok) {
    console.error(`✗ migrations failed (${m.note ?? 'see above'})`);
    return finish(1);
  }
  if (firstRun) writeFileSync(seedStamp, JSON.stringify({ seededAt: new Date().toISOString() }) + '\n');
  const envFile = writeEnvFile(stack);
  console.log(`services ready in ${seconds(started)} s; settings in ${rel(envFile)} (set -a; . ${rel(envFile)}). Stop: Ctrl-C`);
  await new Promise(() => undefined);
}

main().catch((error: unknown) => {
  if (error instanceof StackStartError) console.error(error.message);
  else if (error instanceof ServiceStartError) console.error(describeStartError(error));
  else console.error('npm run services failed:', error);
  void finish(1);
});
