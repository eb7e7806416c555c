// Installs the Debian packages the stack needs on a fresh machine (CI); a no-op when their programs are present.
import { spawn } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import path from 'node:path';

/** The programs that prove a package is installed. */
const PROGRAMS: Record<string, string[]> = {
  'mariadb-server': ['mariadbd', 'mariadb-install-db', 'mariadb-admin', 'mariadb'],
  chromium: ['chromium'],
  'libxml2-utils': ['xmllint'],
};

// mariadbd lives in /usr/sbin, which is not on every user's PATH.
const EXTRA_DIRS = ['/usr/sbin', '/usr/local/sbin', '/sbin', '/usr/bin'];

export function findExecutable(name: string): string | null {
  const dirs = [...(process.env.PATH ?? '').split(path.delimiter).filter(Boolean), ...EXTRA_DIRS];
  for (const dir of dirs) {
    const file = path.join(dir, name);
    try {
      accessSync(file, constants.X_OK);
      return file;
    } catch {
      // not in this directory
    }
  }
  return null;
}

export function requireExecutable(name: string): string {
  const file = findExecutable(name);
  if (!file) throw new Error(`${name} is not installed (looked in PATH and ${EXTRA_DIRS.join(', ')}).`);
  return file;
}

function run(command: string, args: string[]): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    child.once('error', () => resolve(127));
    child.once('exit', (code) => resolve(code ?? 1));
  });
}

let updated = false;

export async function ensureDebianPackages(packages: string[], log: (line: string) => void = console.log): Promise<void> {
  const missing = packages.filter((p) => (PROGRAMS[p] ?? [p]).some((prog) => !findExecutable(prog)));
  if (missing.length === 0) return;
  const apt = findExecutable('apt-get');
  if (!apt) throw new Error(`Missing programs from ${missing.join(', ')} and no apt-get here: install them with your package manager.`);
  // Root installs directly; anyone else needs password-less sudo (CI images usually run as root).
  const sudo = process.getuid?.() === 0 ? [] : findExecutable('sudo') ? ['sudo', '-n', 'env', 'DEBIAN_FRONTEND=noninteractive'] : null;
  if (!sudo) throw new Error(`Not root and no sudo: run as root "apt-get install -y ${missing.join(' ')}".`);
  const started = Date.now();
  log(`installing Debian packages: ${missing.join(', ')} (one-time, about 30–100 s)`);
  const [cmd, ...pre] = [...sudo, apt];
  if (!updated) {
    if ((await run(cmd, [...pre, 'update'])) !== 0) throw new Error('apt-get update failed (see its output above).');
    updated = true;
  }
  const code = await run(cmd, [...pre, 'install', '-y', ...missing]);
  if (code !== 0) throw new Error(`apt-get install -y ${missing.join(' ')} failed with code ${code}.`);
  const still = missing.filter((p) => (PROGRAMS[p] ?? [p]).some((prog) => !findExecutable(prog)));
  if (still.length) throw new Error(`Installed ${still.join(', ')} but its programs are still missing.`);
  log(`installed ${missing.join(', ')} in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}
