// A private MariaDB instance: own datadir, socket and port, never the system config (see stack.md).
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { requireExecutable } from './apt';
import { type DataLayout, projectRoot } from './layout';
import { type Service, ServiceStartError, exitOf, spawnService, stopChild, childAlive, waitUntilReady } from './proc';

const exec = promisify(execFile);

export type MariaDbOptions = { layout: DataLayout; port: number; database: string; log: (line: string) => void };

/** Unix sockets are limited to ~107 bytes; fall back to a short path in the temp dir for deep checkouts. */
function socketPath(layout: DataLayout): string {
  const inside = path.join(layout.run, 'mariadb.sock');
  if (inside.length < 100) return inside;
  return path.join(os.tmpdir(), `ohmstead-${createHash('sha256').update(layout.dir).digest('hex').slice(0, 12)}.sock`);
}

export async function startMariaDb(opts: MariaDbOptions): Promise<Service> {
  const { layout } = opts;
  const name = 'mariadb';
  if (!/^\w+$/.test(opts.database)) throw new ServiceStartError(name, `unsafe database name ${JSON.stringify(opts.database)}`);
  const logFile = path.join(layout.logs, 'mariadb.log');
  const bins = {
    server: requireExecutable('mariadbd'),
    install: requireExecutable('mariadb-install-db'),
    admin: requireExecutable('mariadb-admin'),
    client: requireExecutable('mariadb'),
  };
  const user = os.userInfo().username;
  const socket = socketPath(layout);
  const base = ['--no-defaults', `--socket=${socket}`, '-uroot'];
  mkdirSync(layout.run, { recursive: true });

  if (!existsSync(layout.mariadb) || readdirSync(layout.mariadb).length === 0) {
    mkdirSync(layout.mariadb, { recursive: true });
    const t = Date.now();
    try {
      await exec(bins.install, [
        '--no-defaults', `--datadir=${layout.mariadb}`, `--user=${user}`,
        '--auth-root-authentication-method=normal', '--skip-test-db',
      ], { cwd: projectRoot, maxBuffer: 16 * 1024 * 1024 });
    } catch (error) {
      const e = error as { stderr?: string; stdout?: string; message: string };
      throw new ServiceStartError(name, `mariadb-install-db failed: ${(e.stderr || e.stdout || e.message).trim().split('\n').slice(-20).join('\n')}`);
    }
    opts.log(`mariadb: initialised ${path.relative(projectRoot, layout.mariadb)} in ${((Date.now() - t) / 1000).toFixed(1)} s`);
  }

  // --no-defaults must come first, or /etc/mysql/my.cnf is read (stack.md).
  const child = spawnService(bins.server, [
    '--no-defaults', `--datadir=${layout.mariadb}`, `--socket=${socket}`, `--pid-file=${path.join(layout.run, 'mariadb.pid')}`,
    `--port=${opts.port}`, '--bind-address=127.0.0.1', `--user=${user}`, '--skip-name-resolve', `--log-error=${logFile}`,
    '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci', '--max-allowed-packet=256M',
  ], { cwd: projectRoot, env: process.env, logFile });

  const ping = async () => {
    try {
      await exec(bins.admin, [...base, '--connect-timeout=2', 'ping'], { timeout: 3_000 });
      return true;
    } catch {
      return false;
    }
  };
  const service: Service = {
    name,
    pid: child.pid ?? -1,
    logFile,
    alive: () => childAlive(child),
    exited: exitOf(child),
    async stop() {
      if (!childAlive(child)) return;
      try {
        await exec(bins.admin, [...base, 'shutdown'], { timeout: 30_000 });
      } catch {
        // fall through to signals: a server that cannot be asked to stop is told to
      }
      await Promise.race([exitOf(child), new Promise((r) => setTimeout(r, 30_000))]);
      await stopChild(child, { graceMs: 15_000 });
    },
  };
  try {
    await waitUntilReady(ping, { service: name, child, logFile, timeoutMs: 30_000, intervalMs: 100 });
    // TCP logins from 127.0.0.1 need their own root account once names are not resolved.
    const sql = [
      `CREATE DATABASE IF NOT EXISTS \`${opts.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      `CREATE USER IF NOT EXISTS 'root'@'127.0.0.1'`,
      `GRANT ALL PRIVILEGES ON *.* TO 'root'@'127.0.0.1' WITH GRANT OPTION`,
    ].join(';\n');
    await exec(bins.client, [...base, '-e', sql], { timeout: 30_000 });
  } catch (error) {
    await service.stop();
    if (error instanceof ServiceStartError) throw error;
    const e = error as { stderr?: string; message: string };
    throw new ServiceStartError(name, `could not create database ${opts.database}: ${(e.stderr || e.message).trim()}`, logFile);
  }
  return service;
}
