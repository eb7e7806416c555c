// Child-process plumbing: each service runs in its own process group, logs to a file, and is stopped by pid.
import { spawn, type ChildProcess } from 'node:child_process';
import { createWriteStream, mkdirSync, openSync, closeSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

export type ExitInfo = { code: number | null; signal: NodeJS.Signals | null };

export type Service = {
  name: string;
  pid: number;
  logFile: string;
  alive(): boolean;
  /** Settles when the process has exited, for whatever reason. */
  exited: Promise<ExitInfo>;
  stop(): Promise<void>;
};

export class ServiceStartError extends Error {
  constructor(
    readonly service: string,
    readonly reason: string,
    readonly logFile?: string,
  ) {
    super(`${service} did not start: ${reason}`);
  }
}

const exits = new WeakMap<ChildProcess, Promise<ExitInfo>>();
const failedToSpawn = new WeakSet<ChildProcess>();

/** Resolves when the child has exited, or at once if it could not be spawned at all (ENOENT). */
export function exitOf(child: ChildProcess): Promise<ExitInfo> {
  let p = exits.get(child);
  if (!p) {
    p = new Promise((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) resolve({ code: child.exitCode, signal: child.signalCode });
      child.once('exit', (code, signal) => resolve({ code, signal }));
      child.once('error', () => {
        if (child.pid === undefined) {
          failedToSpawn.add(child);
          resolve({ code: 127, signal: null });
        }
      });
    });
    exits.set(child, p);
  }
  return p;
}

export function childAlive(child: ChildProcess): boolean {
  return !failedToSpawn.has(child) && child.exitCode === null && child.signalCode === null;
}

export type SpawnServiceOptions = {
  env: NodeJS.ProcessEnv;
  cwd: string;
  logFile: string;
  /** Adds an IPC channel: our own Node services report readiness on it and exit when it closes. */
  ipc?: boolean;
  /** Also copy the output to this stream (the app server in `npm start`). */
  tee?: NodeJS.WritableStream;
};

/** Starts a long-running service detached into its own process group, so Ctrl-C reaches only the runner, which stops it in order. */
export function spawnService(command: string, args: string[], opts: SpawnServiceOptions): ChildProcess {
  mkdirSync(path.dirname(opts.logFile), { recursive: true });
  const ipc = opts.ipc ? ['ipc' as const] : [];
  let child: ChildProcess;
  if (opts.tee) {
    child = spawn(command, args, { cwd: opts.cwd, env: opts.env, detached: true, stdio: ['ignore', 'pipe', 'pipe', ...ipc] });
    const log = createWriteStream(opts.logFile, { flags: 'a' });
    const tee = opts.tee;
    for (const stream of [child.stdout, child.stderr]) {
      stream?.on('data', (chunk: Buffer) => {
        log.write(chunk);
        tee.write(chunk);
      });
    }
    child.once('exit', () => log.end());
  } else {
    const fd = openSync(opts.logFile, 'a');
    child = spawn(command, args, { cwd: opts.cwd, env: opts.env, detached: true, stdio: ['ignore', fd, fd, ...ipc] });
    closeSync(fd);
  }
  void exitOf(child);
  return child;
}

function signalGroup(pid: number, signal: NodeJS.Signals | 0): boolean {
  try {
    process.kill(-pid, signal);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitGroupGone(pid: number, ms: number): Promise<boolean> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (!signalGroup(pid, 0)) return true;
    await sleep(50);
  }
  return !signalGroup(pid, 0);
}

/** Signals the child's group, waits, escalates to SIGKILL; also reaps grandchildren left in the group. */
export async function stopChild(child: ChildProcess, opts: { signal?: NodeJS.Signals; graceMs?: number } = {}): Promise<void> {
  const pid = child.pid;
  if (pid === undefined) return;
  const grace = opts.graceMs ?? 10_000;
  if (childAlive(child)) {
    signalGroup(pid, opts.signal ?? 'SIGTERM');
    const done = await Promise.race([exitOf(child).then(() => true), sleep(grace).then(() => false)]);
    if (!done) {
      signalGroup(pid, 'SIGKILL');
      await exitOf(child);
    }
  }
  if (signalGroup(pid, 0)) {
    signalGroup(pid, 'SIGTERM');
    if (!(await waitGroupGone(pid, 2_000))) signalGroup(pid, 'SIGKILL');
  }
}

/** Last-resort, synchronous: used from process.on('exit') when the runner dies with services still up. */
export function terminateGroupNow(pid: number | undefined): void {
  if (pid !== undefined) signalGroup(pid, 'SIGTERM');
}

export type WaitOptions = { service: string; child: ChildProcess; logFile: string; timeoutMs: number; intervalMs?: number };

/** Polls `check` until true; fails early if the child died, or after the timeout. */
export async function waitUntilReady(check: () => Promise<boolean>, opts: WaitOptions): Promise<void> {
  const started = Date.now();
  for (;;) {
    if (!childAlive(opts.child)) {
      const { code, signal } = await exitOf(opts.child);
      throw new ServiceStartError(opts.service, `the process exited (${signal ?? `code ${code}`})`, opts.logFile);
    }
    if (await check()) return;
    if (Date.now() - started > opts.timeoutMs) {
      throw new ServiceStartError(opts.service, `not ready after ${Math.round(opts.timeoutMs / 1000)} s`, opts.logFile);
    }
    await sleep(opts.intervalMs ?? 100);
  }
}

/** Our own Node services send {type:'ready'} over IPC once they listen. */
export function waitForReadyMessage(child: ChildProcess, service: string, logFile: string, timeoutMs: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => done(new ServiceStartError(service, `not ready after ${timeoutMs / 1000} s`, logFile)), timeoutMs);
    const onMessage = (m: unknown) => {
      if (typeof m === 'object' && m !== null && (m as { type?: unknown }).type === 'ready') done();
    };
    let settled = false;
    function done(error?: Error) {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      child.off('message', onMessage);
      if (error) reject(error);
      else resolve();
    }
    child.on('message', onMessage);
    void exitOf(child).then(({ code, signal }) =>
      done(new ServiceStartError(service, `the process exited (${signal ?? `code ${code}`})`, logFile)),
    );
  });
}

export async function httpResponds(url: string): Promise<boolean> {
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(2_000), redirect: 'manual' });
    await res.body?.cancel();
    return true;
  } catch {
    return false;
  }
}

export function tailFile(file: string, lines = 20): string {
  try {
    const size = statSync(file).size;
    const buf = readFileSync(file);
    const text = buf.subarray(Math.max(0, size - 64 * 1024)).toString('utf8');
    return text.trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no log written)';
  }
}
