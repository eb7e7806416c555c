import 'server-only';
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { Transform } from 'node:stream';

// The MariaDB command-line tools (Debian package mariadb-client), run with --no-defaults first so that no
// my.cnf is read (stack.md), over TCP to the host and port of DATABASE_URL; the password goes in MYSQL_PWD, not argv.

export type DbTarget = { host: string; port: number; user: string; password: string; database: string };

const DB_NAME = /^[A-Za-z0-9_]{1,64}$/;

export function assertDatabaseName(name: string): string {
  if (!DB_NAME.test(name)) throw new Error(`"${name}" is not a database name we accept (letters, digits, underscore; at most 64).`);
  return name;
}

/** The target a mysql:// URL names, optionally with another database name. */
export function dbTarget(databaseUrl: string, database?: string): DbTarget {
  const url = new URL(databaseUrl);
  return {
    host: url.hostname, port: Number(url.port || 3306), user: decodeURIComponent(url.username || 'root'),
    password: decodeURIComponent(url.password), database: assertDatabaseName(database ?? url.pathname.replace(/^\//, '')),
  };
}

function connectionArgs(t: DbTarget): string[] {
  return ['--no-defaults', '--protocol=TCP', `--host=${t.host}`, `--port=${t.port}`, `--user=${t.user}`, '--default-character-set=utf8mb4'];
}

function run(command: string, args: string[], t: DbTarget, io: { stdin?: NodeJS.ReadableStream; stdout?: NodeJS.WritableStream } = {}): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      env: { ...process.env, ...(t.password ? { MYSQL_PWD: t.password } : {}) },
      stdio: [io.stdin ? 'pipe' : 'ignore', 'pipe', 'pipe'],
    });
    const { stdout, stderr } = child;
    if (!stdout || !stderr) throw new Error(`${command}: no output pipes`);
    let out = '';
    let err = '';
    stderr.on('data', (c: Buffer) => (err += c.toString('utf8')));
    if (io.stdout) stdout.pipe(io.stdout);
    else stdout.on('data', (c: Buffer) => (out += c.toString('utf8')));
    if (io.stdin && child.stdin) {
      io.stdin.on('error', (e) => {
        child.kill('SIGTERM');
        reject(e);
      });
      child.stdin.on('error', () => undefined); // EPIPE when the client stops early; its exit code tells why
      io.stdin.pipe(child.stdin);
    }
    child.on('error', (e: NodeJS.ErrnoException) =>
      reject(e.code === 'ENOENT' ? new Error(`${command} is not installed (Debian package mariadb-client).`) : e));
    child.on('close', (code) => (code === 0 ? resolve(out) : reject(new Error(`${command} exited with ${code}: ${err.trim().slice(0, 2000)}`))));
  });
}

/** One SQL statement through the `mariadb` client; rows come back tab-separated without headers. */
export function sql(t: DbTarget, statement: string, database?: string): Promise<string> {
  return run('mariadb', [...connectionArgs(t), '--batch', '--skip-column-names', `--execute=${statement}`, ...(database ? [database] : [])], t);
}

/**
 * mariadb-dump of one database into `file`: --single-transaction gives one consistent InnoDB snapshot without
 * locking writers; no --databases, so the dump carries no CREATE DATABASE/USE and loads into any name.
 */
export async function dumpDatabase(t: DbTarget, file: string): Promise<{ sizeBytes: number; sha256: string }> {
  const hash = createHash('sha256');
  let sizeBytes = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      sizeBytes += chunk.length;
      done(null, chunk);
    },
  });
  const sink = createWriteStream(file, { mode: 0o600 });
  await Promise.all([
    pipeline(counter, sink),
    run('mariadb-dump', [...connectionArgs(t), '--single-transaction', '--quick', '--routines', '--triggers', '--hex-blob', t.database], t, { stdout: counter }),
  ]);
  return { sizeBytes, sha256: hash.digest('hex') };
}

/** Feeds a dump file to the `mariadb` client against t.database. */
export async function loadDump(t: DbTarget, file: string): Promise<void> {
  await run('mariadb', [...connectionArgs(t), '--max-allowed-packet=256M', t.database], t, { stdin: createReadStream(file) });
}

export async function tableCount(t: DbTarget): Promise<number> {
  const out = await sql(t, `SELECT COUNT(*) FROM information_schema.TABLES WHERE TABLE_SCHEMA = '${assertDatabaseName(t.database)}'`);
  return Number(out.trim());
}

export async function createDatabase(t: DbTarget, opts: { replace: boolean }): Promise<void> {
  const name = assertDatabaseName(t.database);
  if (opts.replace) await sql(t, `DROP DATABASE IF EXISTS \`${name}\``);
  await sql(t, `CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
}
