// Pid files under <data>/run: a lock against two runners on one data dir, and clean-up after a runner that was killed.
import { mkdirSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { type DataLayout, projectRoot, rel } from './layout';
import { ConfigError } from './ports';

export type PidEntry = { name: string; pid: number; marker: string };

export function writePid(layout: DataLayout, name: string, pid: number, marker = ''): void {
  mkdirSync(layout.run, { recursive: true });
  writeFileSync(path.join(layout.run, `${name}.pid`), marker ? `${pid}\n${marker}\n` : `${pid}\n`);
}

export function removePid(layout: DataLayout, name: string): void {
  rmSync(path.join(layout.run, `${name}.pid`), { force: true });
}

export function readPids(layout: DataLayout): PidEntry[] {
  let names: string[];
  try {
    names = readdirSync(layout.run).filter((n) => n.endsWith('.pid'));
  } catch {
    return [];
  }
  return names.flatMap((n) => {
    const [pidLine = '', marker = ''] = readFileSync(path.join(layout.run, n), 'utf8').split('\n');
    const pid = Number(pidLine.trim());
    return Number.isInteger(pid) && pid > 1 ? [{ name: n.slice(0, -4), pid, marker: marker.trim() }] : [];
  });
}

function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** True only for a live process working inside this project (guards against a recycled pid). */
function belongsHere(entry: PidEntry): boolean {
  if (!pidAlive(entry.pid)) return false;
  try {
    const cwd = readlinkSync(`/proc/${entry.pid}/cwd`);
    if (cwd !== projectRoot && !cwd.startsWith(projectRoot + path.sep)) return false;
    if (!entry.marker) return true;
    return readFileSync(`/proc/${entry.pid}/cmdline`, 'utf8').includes(entry.marker);
  } catch {
    return false;
  }
}

export function runningFrom(layout: DataLayout): PidEntry[] {
  return readPids(layout).filter(belongsHere);
}

/** Refuses a second runner on the same data dir; the first one's services would be clobbered. */
export function acquireRunnerLock(layout: DataLayout, script: string): void {
  const runner = readPids(layout).find((e) => e.name === 'runner');
  if (runner && runner.pid !== process.pid && belongsHere(runner)) {
    throw new ConfigError(
      `Ohmstead is already running from ${rel(layout.dir)} (runner pid ${runner.pid}). Stop it first (Ctrl-C in its terminal, or kill -INT ${runner.pid}).`,
    );
  }
  writePid(layout, 'runner', process.pid, script);
  if (!lockHolders.has(layout.run)) {
    lockHolders.add(layout.run);
    process.once('exit', () => {
      const mine = readPids(layout).find((e) => e.name === 'runner' && e.pid === process.pid);
      if (mine) removePid(layout, 'runner');
    });
  }
}

const lockHolders = new Set<string>();

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function signal(pid: number, sig: NodeJS.Signals): void {
  for (const target of [-pid, pid]) {
    try {
      process.kill(target, sig);
      return;
    } catch {
      // not a group leader, or already gone: try the plain pid next
    }
  }
}

/** Stops services a killed runner left behind (their pid files point at live processes of this project). */
export async function stopLeftovers(layout: DataLayout, log: (line: string) => void): Promise<void> {
  const left = runningFrom(layout).filter((e) => e.name !== 'runner');
  for (const e of left) {
    log(`stopping ${e.name} (pid ${e.pid}) left running by an earlier run that did not exit cleanly`);
    signal(e.pid, 'SIGTERM');
  }
  const until = Date.now() + 30_000;
  while (left.some((e) => pidAlive(e.pid)) && Date.now() < until) await sleep(100);
  for (const e of left.filter((x) => pidAlive(x.pid))) signal(e.pid, 'SIGKILL');
  for (const e of left) removePid(layout, e.name);
}
