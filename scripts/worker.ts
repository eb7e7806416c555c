// The background worker: file analysis, the outbox (DOI reservations, package builds, …) and the cleanup of abandoned
// uploads, off the request path. Run as `node --conditions=react-server --import tsx scripts/worker.ts` (the condition
// makes 'server-only' importable outside Next); scripts/stack starts it for npm start / npm test. Several may run at
// once.
import { runAnalysisOnce } from '@/lib/analysis/run-analysis';
import { db } from '@/lib/db';
import { packageOutboxHandlers } from '@/lib/downloads/package-build-job';
import { env } from '@/lib/env';
import { log } from '@/lib/log';
import { processOutboxOnce } from '@/lib/outbox/process-outbox';
import { sweepEndedEmbargoes } from '@/lib/publishing/notify-embargo-end';
import { cleanupStaleUploads } from '@/lib/uploads/cleanup-stale-uploads';
import { announceReady, onStop } from './fakes/lifecycle';

const OUTBOX_EVERY_MS = 2_000;
const CLEANUP_EVERY_MS = 5 * 60_000;
const IDLE_MS = 1_000;
const MAX_BACKOFF_MS = 30_000;

const stopping = new AbortController();
let loopDone: Promise<void> = Promise.resolve();

// Each wait removes its abort listener when it ends, so the idle loops never pile listeners on the signal.
const sleep = (ms: number) =>
  new Promise<void>((resolve) => {
    const wake = () => (clearTimeout(t), resolve());
    const t = setTimeout(() => (stopping.signal.removeEventListener('abort', wake), resolve()), ms);
    stopping.signal.addEventListener('abort', wake, { once: true });
  });

// The same failure (tables not migrated yet, a service down) is logged once a minute, not on every turn.
const lastLogged = new Map<string, number>();
function logFailure(task: string, error: unknown): void {
  const message = error instanceof Error ? error.message : String(error);
  const key = `${task}:${message}`;
  if (Date.now() - (lastLogged.get(key) ?? 0) < 60_000) return;
  lastLogged.set(key, Date.now());
  log('warn', `worker: ${task} failed; retrying`, { error: message });
}

/** Runs `task` at most every `everyMs`; a failure delays the next try with doubling backoff. */
function periodic(name: string, everyMs: number, task: () => Promise<unknown>) {
  let next = 0;
  let failures = 0;
  return async () => {
    if (Date.now() < next) return;
    try {
      await task();
      failures = 0;
      next = Date.now() + everyMs;
    } catch (error) {
      failures += 1;
      logFailure(name, error);
      next = Date.now() + Math.min(MAX_BACKOFF_MS, everyMs * 2 ** failures);
    }
  };
}

async function loop(): Promise<void> {
  const outbox = periodic('outbox', OUTBOX_EVERY_MS, () => processOutboxOnce());
  const cleanup = periodic('upload cleanup', CLEANUP_EVERY_MS, () => cleanupStaleUploads());
  // Embargo-ended mail goes out on first access or by this sweep, whichever comes first.
  const embargoSweep = periodic('embargo sweep', CLEANUP_EVERY_MS, () => sweepEndedEmbargoes());
  let analysisFailures = 0;
  while (!stopping.signal.aborted) {
    let busy = false;
    try {
      const result = await runAnalysisOnce({ signal: stopping.signal });
      if (result) log('info', 'worker: analysed a file', { ...result });
      busy = result !== null && result.outcome !== 'released';
      analysisFailures = result?.outcome === 'released' ? analysisFailures + 1 : 0;
    } catch (error) {
      analysisFailures += 1;
      logFailure('analysis', error);
    }
    await outbox();
    await cleanup();
    await embargoSweep();
    if (!busy) await sleep(analysisFailures ? Math.min(MAX_BACKOFF_MS, IDLE_MS * 2 ** analysisFailures) : IDLE_MS);
  }
}

// Cache builds of packages (lib/downloads/package-build-job.ts) are outbox jobs too, but one may take minutes: they run
// one at a time in a loop of their own, so mail, DOIs and analysis never wait for them. Stopping aborts a running
// build (nothing is stored; the job is given back untried, for the next worker).
async function packageLoop(): Promise<void> {
  const handlers = packageOutboxHandlers({ signal: stopping.signal });
  let failures = 0;
  while (!stopping.signal.aborted) {
    let claimed = false;
    try {
      claimed = (await processOutboxOnce(handlers, { limit: 1 })).claimed > 0;
      failures = 0;
    } catch (error) {
      failures += 1;
      logFailure('package builds', error);
    }
    if (!claimed) await sleep(failures ? Math.min(MAX_BACKOFF_MS, OUTBOX_EVERY_MS * 2 ** failures) : OUTBOX_EVERY_MS);
  }
}

env(); // fail fast, with every missing setting named, before announcing readiness
onStop(async () => {
  stopping.abort();
  await loopDone;
  await db().destroy();
});
const crashed = (error: unknown) => {
  log('error', 'worker loop crashed', { error: error instanceof Error ? error.stack : String(error) });
  process.exit(1);
};
loopDone = Promise.all([loop().catch(crashed), packageLoop().catch(crashed)]).then(() => undefined);
announceReady('worker running: analysis, outbox, package builds, upload cleanup');
