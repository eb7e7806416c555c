// Starts one of our own TypeScript service processes (s3rver wrapper, SMTP fake, DOI fake) under tsx.
import path from 'node:path';
import { type DataLayout, projectRoot } from './layout';
import { writePid, removePid } from './pidfiles';
import { type Service, exitOf, childAlive, spawnService, stopChild, waitForReadyMessage } from './proc';

export type NodeServiceOptions = {
  layout: DataLayout;
  name: string;
  /** Path relative to the project root. */
  script: string;
  env: Record<string, string>;
  timeoutMs?: number;
};

export async function startNodeService(opts: NodeServiceOptions): Promise<Service> {
  const logFile = path.join(opts.layout.logs, `${opts.name}.log`);
  const script = path.join(projectRoot, opts.script);
  const child = spawnService(process.execPath, ['--import', 'tsx', script], {
    cwd: projectRoot,
    env: { ...process.env, ...opts.env },
    logFile,
    ipc: true,
  });
  const service: Service = {
    name: opts.name,
    pid: child.pid ?? -1,
    logFile,
    alive: () => childAlive(child),
    exited: exitOf(child),
    async stop() {
      await stopChild(child, { graceMs: 8_000 });
      removePid(opts.layout, opts.name);
    },
  };
  if (child.pid !== undefined) writePid(opts.layout, opts.name, child.pid, script);
  try {
    await waitForReadyMessage(child, opts.name, logFile, opts.timeoutMs ?? 30_000);
  } catch (error) {
    await service.stop();
    throw error;
  }
  // The IPC channel stays open: its closing is how the child learns that the runner died.
  return service;
}
