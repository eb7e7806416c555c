// `npm test`: services (test profile, fresh .test-data/) → migrate+seed → lint, typecheck, vitest, build, e2e → totals.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages } from './stack/apt';
import { migrate } from './stack/app-setup';
import { bin, handleSignals, interruptedBy, runForeground, seconds } from './stack/foreground';
import { type Stack, StackStartError, describeStartError, startStack } from './stack/index';
import { profileLayout, rel } from './stack/layout';
import { buildApp, startApp } from './stack/next-app';
import { ServiceStartError, tailFile } from './stack/proc';
import { type SuiteResult, countVitest, stepResult, summaryTable, totalsLine } from './stack/totals';
import { readFile } from 'node:fs/promises';

const started = Date.now();
const results: SuiteResult[] = [];
let stack: Stack | undefined;
let finishing: Promise<never> | undefined;

const banner = (title: string) => console.log(`\n━━ ${title} ${'━'.repeat(Math.max(4, 60 - title.length))}`);

function finish(): Promise<never> {
  return (finishing ??= (async () => {
    const t = Date.now();
    if (stack) await stack.stop().catch((e: unknown) => console.error('error while stopping services:', e));
    const layout = profileLayout('test');
    if (process.env.OHMSTEAD_KEEP_TEST_DATA === '1') console.log(`kept ${rel(layout.dir)}/ (OHMSTEAD_KEEP_TEST_DATA=1)`);
    else rmSync(layout.dir, { recursive: true, force: true });
    const sig = interruptedBy();
    if (sig) results.push(stepResult('interrupted', false, 0, `${sig}: the run was stopped before the end`));
    console.log(`\nservices stopped in ${seconds(t)} s; whole run ${seconds(started)} s\n`);
    console.log(summaryTable(results));
    const failed = results.some((r) => r.failed > 0);
    console.log(totalsLine(results));
    process.exit(sig ? 130 : failed ? 1 : 0);
  })());
}

handleSignals(() => void finish());

async function step(name: string, command: string, args: string[], env: NodeJS.ProcessEnv): Promise<boolean> {
  banner(name);
  const r = await runForeground(command, args, env);
  results.push(stepResult(name, r.code === 0, r.seconds, r.code === 0 ? undefined : `exit code ${r.code}`));
  return r.code === 0;
}

async function vitestSuite(name: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  banner(name);
  const report = path.join(stack?.layout.reports ?? '/tmp', `${name}.json`);
  const r = await runForeground(bin('vitest'), ['run', ...args, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`], env);
  let json: unknown;
  try {
    json = JSON.parse(await readFile(report, 'utf8'));
  } catch {
    json = undefined;
  }
  results.push(countVitest(name, json, r.code, r.seconds));
}

async function main(): Promise<void> {
  await ensureDebianPackages(['mariadb-server', 'chromium', 'libxml2-utils']);
  banner('services');
  const t = Date.now();
  try {
    stack = await startStack('test', { command: 'npm test', script: 'scripts/test.ts', wipe: true });
    results.push(stepResult('services', true, (Date.now() - t) / 1000));
  } catch (error) {
    if (interruptedBy()) return void finish();
    console.error(error instanceof StackStartError ? error.message : error instanceof ServiceStartError ? describeStartError(error) : String(error));
    results.push(stepResult('services', false, (Date.now() - t) / 1000, 'see the message above'));
  }
  const env = { ...process.env, ...(stack?.env ?? {}) };

  if (stack) {
    banner('migrate');
    // One migrate + demo seed up front: integration tests add their own rows, e2e needs the demo accounts.
    const m = await migrate(stack, true);
    if (m.missing) console.error(`✗ ${m.note}`);
    results.push(stepResult('migrate', m.ok, m.seconds, m.note));
  }
  if (interruptedBy()) return;
  await step('lint', bin('eslint'), ['.'], env);
  if (interruptedBy()) return;
  await step('typecheck', bin('tsc'), ['--noEmit'], env);
  if (interruptedBy()) return;
  if (!stack) {
    for (const name of ['vitest', 'build', 'e2e']) results.push(stepResult(name, false, 0, 'not run: the services did not start'));
    return void finish();
  }
  await vitestSuite('vitest', [], { ...env, NODE_ENV: 'test' });
  if (interruptedBy()) return;

  banner('build');
  const b = await buildApp(stack);
  results.push(stepResult('build', b.code === 0, b.seconds, b.code === 0 ? undefined : `next build exit code ${b.code}`));
  if (interruptedBy()) return;
  if (b.code !== 0) {
    results.push(stepResult('e2e', false, 0, 'not run: the build failed'));
    return void finish();
  }
  banner('app');
  try {
    const t2 = Date.now();
    await startApp(stack);
    console.log(`app ready at ${stack.env.E2E_BASE_URL} (${seconds(t2)} s)`);
  } catch (error) {
    if (interruptedBy()) return;
    const e = error instanceof ServiceStartError ? describeStartError(error) : String(error);
    console.error(e);
    results.push(stepResult('e2e', false, 0, 'not run: next start failed'));
    return void finish();
  }
  // Until tests/e2e has files this reports "no test files" (0 tests) rather than failing the run.
  await vitestSuite('e2e', ['-c', 'vitest.e2e.config.ts', '--passWithNoTests'], { ...env, NODE_ENV: 'test' });
  if (interruptedBy()) return;
  const appLog = path.join(stack.layout.logs, 'app.log');
  if (results.at(-1)?.failed) console.log(`\nlast lines of ${rel(appLog)}:\n${tailFile(appLog, 20)}`);
  return void finish();
}

main().catch((error: unknown) => {
  console.error('npm test runner error:', error);
  results.push(stepResult('runner', false, 0, String(error)));
  void finish();
});
