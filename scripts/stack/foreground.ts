// One-shot commands (migrate, lint, build, vitest) run in the foreground, and the runner's signal handling.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { projectRoot } from './layout';

let current: ChildProcess | undefined;

export type RunResult = { code: number; signal: NodeJS.Signals | null; seconds: number };

/** Runs a command with inherited output; an interrupt of the runner also ends it. */
export function runForeground(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<RunResult> {
  const started = Date.now();
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: projectRoot, env, stdio: ['ignore', 'inherit', 'inherit'] });
    current = child;
    const finish = (code: number, signal: NodeJS.Signals | null) => {
      if (current === child) current = undefined;
      resolve({ code, signal, seconds: (Date.now() - started) / 1000 });
    };
    child.once('error', (error) => {
      console.error(`could not run ${command}: ${error.message}`);
      finish(127, null);
    });
    child.once('exit', (code, signal) => finish(code ?? 1, signal));
  });
}

export function bin(name: string): string {
  return path.join(projectRoot, 'node_modules', '.bin', name);
}

let interrupted: NodeJS.Signals | null = null;
export const interruptedBy = () => interrupted;

/**
 * First SIGINT/SIGTERM/SIGHUP: stop the foreground command and call `onSignal` once (it stops the services).
 * Ctrl-C in a terminal reaches us twice (directly and forwarded by bootstrap.mjs); repeats only print a note.
 */
export function handleSignals(onSignal: (signal: NodeJS.Signals) => void): void {
  const handle = (sig: NodeJS.Signals, why: string) => {
    if (interrupted) {
      console.log(`(${sig} again: still stopping services, please wait)`);
      return;
    }
    interrupted = sig;
    console.log(`\n${why}: stopping…`);
    current?.kill('SIGTERM');
    onSignal(sig);
  };
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => handle(sig, `${sig} received`));
  // If bootstrap.mjs (our parent) is killed outright we are re-parented: treat it as SIGTERM so nothing is left running.
  const parent = process.ppid;
  const watch = setInterval(() => {
    if (process.ppid === parent) return;
    clearInterval(watch);
    handle('SIGTERM', `parent process ${parent} went away`);
  }, 500).unref();
}

export const seconds = (since: number) => ((Date.now() - since) / 1000).toFixed(1);
