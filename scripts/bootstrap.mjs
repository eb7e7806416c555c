// Entry for `npm start`, `npm test`, `npm run reset` and `npm run services`. Plain Node, no dependencies: node_modules may not exist yet.
// Installs dependencies when missing or stale, then runs scripts/<command>.ts under tsx, passing signals and the exit code through.
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const COMMANDS = ['start', 'test', 'reset', 'services'];
const [command, ...args] = process.argv.slice(2);
if (!COMMANDS.includes(command)) {
  console.error(`usage: node scripts/bootstrap.mjs <${COMMANDS.join('|')}> [args…]`);
  process.exit(2);
}

const lockFile = path.join(root, 'package-lock.json');
const modules = path.join(root, 'node_modules');
const hiddenLock = path.join(modules, '.package-lock.json');
// Our stamp: the sha256 of the package-lock.json that the current node_modules was installed from.
const stamp = path.join(modules, '.ohmstead-lock.sha256');

function lockHash() {
  return createHash('sha256').update(readFileSync(lockFile)).digest('hex');
}

/** Why node_modules must be (re)installed, or null when it matches the lock file. */
function staleReason() {
  if (!existsSync(modules)) return 'node_modules is missing';
  if (!existsSync(hiddenLock)) return 'node_modules has no .package-lock.json (not installed by npm)';
  if (existsSync(stamp)) return readFileSync(stamp, 'utf8').trim() === lockHash() ? null : 'package-lock.json changed since the last install';
  // No stamp yet (installed by hand): trust npm's own record unless the lock file is newer than it.
  return statSync(lockFile).mtimeMs > statSync(hiddenLock).mtimeMs ? 'package-lock.json is newer than node_modules' : null;
}

if (!existsSync(lockFile)) {
  console.error('package-lock.json is missing: dependencies must come from the committed lock file.');
  process.exit(1);
}
const reason = staleReason();
if (reason) {
  const t = Date.now();
  console.log(`${reason}: running npm ci`);
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error(`npm ci failed (${r.error ? r.error.message : r.signal ?? `exit code ${r.status}`}).`);
    process.exit(r.status || 1);
  }
  console.log(`npm ci done in ${((Date.now() - t) / 1000).toFixed(0)} s`);
}
if (!existsSync(stamp) || reason) writeFileSync(stamp, lockHash() + '\n');
if (!existsSync(path.join(modules, 'tsx'))) {
  console.error('tsx is not installed in node_modules; it is a devDependency, so install with dev dependencies (npm ci).');
  process.exit(1);
}

const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'scripts', `${command}.ts`), ...args], {
  cwd: root,
  stdio: 'inherit',
});
// npm and a terminal deliver signals to us; the runner must get them to stop its services in order.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => {
    if (child.exitCode === null && child.signalCode === null) child.kill(signal);
  });
}
// `npm` runs us through `sh -c`; when npm is killed with SIGTERM the shell dies without telling us and we are
// re-parented. Notice that and stop the runner the same way, so no service outlives npm.
const parent = process.ppid;
const watch = setInterval(() => {
  if (process.ppid === parent) return;
  clearInterval(watch);
  if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
}, 500).unref();
child.on('error', (error) => {
  console.error(`could not start node: ${error.message}`);
  process.exit(1);
});
child.on('exit', (code, signal) => {
  process.exit(code ?? (signal === 'SIGINT' ? 130 : signal === 'SIGTERM' ? 143 : 1));
});
