// Shared by our own service processes: tell the runner we listen, and stop cleanly when told or orphaned.

/** Reads a required setting from the environment the runner passes, failing with its name. */
export function setting(name: string): string {
  const value = process.env[name];
  if (!value) {
    console.error(`${name} is not set; this process is started by scripts/stack (npm start / npm test).`);
    process.exit(2);
  }
  return value;
}

export function announceReady(what: string): void {
  console.log(`${new Date().toISOString()} ${what}`);
  process.send?.({ type: 'ready' });
}

/** Runs `close` on SIGTERM/SIGINT, or when the runner's IPC channel closes (the runner died), then exits. */
export function onStop(close: () => Promise<void>): void {
  let stopping = false;
  const stop = (why: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${new Date().toISOString()} stopping (${why})`);
    const force = setTimeout(() => process.exit(0), 5_000);
    force.unref();
    close()
      .catch((error: unknown) => console.error('error while stopping:', error))
      .finally(() => process.exit(0));
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('disconnect', () => stop('runner went away'));
}
