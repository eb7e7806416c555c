// Building and serving the Next.js app: rebuild only when sources changed, hold the real server pid.
import { createHash } from 'node:crypto';
import { lookup } from 'node:dns/promises';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { runForeground, type RunResult } from './foreground';
import type { Stack } from './index';
import { projectRoot } from './layout';
import { removePid, writePid } from './pidfiles';
import { type Service, exitOf, ServiceStartError, childAlive, httpResponds, spawnService, stopChild, waitUntilReady } from './proc';

const NEXT_BIN = path.join(projectRoot, 'node_modules', 'next', 'dist', 'bin', 'next');
const STAMP = path.join(projectRoot, '.next', 'ohmstead-build.json');
const SKIP_DIRS = new Set(['node_modules', '.next', '.data', '.test-data', '.git', 'coverage', 'tmp']);
// Written by `next build` / `tsc` themselves; hashing them would make every build look stale.
const SKIP_FILES = new Set(['next-env.d.ts', 'tsconfig.tsbuildinfo']);

/** Fingerprint of every source file (path, size, mtime): cheap, and any edit changes it. */
export function sourcesFingerprint(root = projectRoot): string {
  const hash = createHash('sha256');
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
      if (entry.isDirectory()) {
        if (!SKIP_DIRS.has(entry.name)) walk(path.join(dir, entry.name));
      } else if (entry.isFile() && !SKIP_FILES.has(entry.name) && !entry.name.endsWith('.tsbuildinfo')) {
        const file = path.join(dir, entry.name);
        const st = statSync(file);
        hash.update(`${path.relative(root, file)}\0${st.size}\0${st.mtimeMs}\n`);
      }
    }
  };
  walk(root);
  return hash.digest('hex');
}

type BuildStamp = { profile: string; sources: string; nextauthUrl: string };

function stampFor(stack: Stack): BuildStamp {
  return { profile: stack.profile, sources: sourcesFingerprint(), nextauthUrl: stack.env.NEXTAUTH_URL };
}

export function buildIsCurrent(stack: Stack): boolean {
  if (!existsSync(path.join(projectRoot, '.next', 'BUILD_ID')) || !existsSync(STAMP)) return false;
  try {
    return JSON.stringify(JSON.parse(readFileSync(STAMP, 'utf8'))) === JSON.stringify(stampFor(stack));
  } catch {
    return false;
  }
}

export function appEnv(stack: Stack): NodeJS.ProcessEnv {
  return { ...process.env, ...stack.env, NODE_ENV: 'production' };
}

export async function buildApp(stack: Stack): Promise<RunResult> {
  const before = stampFor(stack);
  const result = await runForeground(process.execPath, [NEXT_BIN, 'build'], appEnv(stack));
  // Stamp with the fingerprint taken before the build, so an edit made during it still triggers the next one.
  if (result.code === 0) writeFileSync(STAMP, JSON.stringify(before) + '\n');
  return result;
}

/** Binds 127.0.0.1 when `localhost` resolves to it (so http://localhost:PORT works), else binds `localhost` itself. */
export async function bindHost(): Promise<string> {
  try {
    const all = await lookup('localhost', { all: true });
    return all.some((a) => a.address === '127.0.0.1') ? '127.0.0.1' : 'localhost';
  } catch {
    return '127.0.0.1';
  }
}

export async function startApp(stack: Stack, opts: { tee?: NodeJS.WritableStream } = {}): Promise<Service> {
  const host = await bindHost();
  const port = String(stack.ports.PORT);
  const logFile = path.join(stack.layout.logs, 'app.log');
  // Run next's own entry with node so the pid we hold is the server's, not npm's (stack.md).
  const child = spawnService(process.execPath, [NEXT_BIN, 'start', '-p', port, '-H', host], {
    cwd: projectRoot, env: appEnv(stack), logFile, tee: opts.tee,
  });
  const service: Service = {
    name: 'app',
    pid: child.pid ?? -1,
    logFile,
    alive: () => childAlive(child),
    exited: exitOf(child),
    async stop() {
      await stopChild(child, { graceMs: 10_000 });
      removePid(stack.layout, 'app');
    },
  };
  stack.adopt(service);
  if (child.pid !== undefined) writePid(stack.layout, 'app', child.pid);
  // The liveness route: answers as soon as the server does, without rendering a page or reading the database.
  const probe = `http://${host === 'localhost' ? 'localhost' : '127.0.0.1'}:${port}/api/health/live`;
  try {
    await waitUntilReady(() => httpResponds(probe), { service: 'app (next start)', child, logFile, timeoutMs: 60_000, intervalMs: 200 });
  } catch (error) {
    if (error instanceof ServiceStartError) throw error;
    throw new ServiceStartError('app (next start)', String(error), logFile);
  }
  return service;
}
