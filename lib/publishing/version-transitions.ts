import 'server-only';
import type { Action, SiteRole, VersionState } from '@/lib/access';
import { requireVersionAction, type VersionContext } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';
import { plural } from '@/lib/format/plural';
import { log } from '@/lib/log';
import { defaultOutboxHandlers, tryOutboxJobNow, type OutboxHandlers } from '@/lib/outbox/process-outbox';
import { noteCommittedJobs } from '@/lib/search/search-changed';
import { listUnfinishedUploads } from './repo';
import { applyTransition, type LockedVersion, type TransitionPlan } from './repo-transitions';

// The shared path of every state transition: lib/access check, one locked transaction, then the outbox jobs.

/** Who acts: a signed-in user (session or API token). */
export type ActingUser = { id: string; name: string; siteRole: SiteRole };

export type TransitionDeps = {
  /** Outbox handlers for the first try after commit (tests point DOI or SMTP elsewhere); default: the app's. */
  handlers?: OutboxHandlers;
};

/** Workers leave a fresh job alone this long, while the request tries it itself right after commit. */
export const FIRST_TRY_HOLD_MS = 60_000;

export type TransitionResult = { ctx: VersionContext; locked: LockedVersion; jobIds: number[]; outcomes: string[] };

/** Tries each job once now, in order; a failure stays in the outbox with its retry time (never thrown). */
export async function tryJobsNow(ids: number[], handlers: OutboxHandlers): Promise<string[]> {
  const outcomes: string[] = [];
  for (const id of ids) {
    try {
      outcomes.push(await tryOutboxJobNow(id, handlers));
    } catch (error) {
      outcomes.push('failed');
      log('warn', 'first try of an outbox job failed; the worker retries it', { id, error: error instanceof Error ? error.message : String(error) });
    }
  }
  return outcomes;
}

export async function runTransition<P>(
  args: {
    user: ActingUser | null;
    versionId: string;
    action: Action;
    /** Reads and checks before the transaction (recipients, input); may throw. */
    prepare: (ctx: VersionContext, user: ActingUser) => Promise<P>;
    /** Decides the writes from the row as locked; may throw (nothing is written then). */
    plan: (locked: LockedVersion, prepared: P, ctx: VersionContext, user: ActingUser) => TransitionPlan;
  },
  deps: TransitionDeps = {},
): Promise<TransitionResult> {
  const ctx = await requireVersionAction(args.versionId, args.user, args.action);
  const { user } = args;
  // Unreachable: the table grants no transition to anonymous visitors; this narrows the type.
  if (!user) throw new AppError('not_signed_in', 'Sign in to change this version.');
  const prepared = await args.prepare(ctx, user);
  const { jobIds, jobs, locked } = await applyTransition(args.versionId, ctx.version.state as VersionState, (row) => args.plan(row, prepared, ctx, user));
  noteCommittedJobs(jobs);
  const outcomes = await tryJobsNow(jobIds, deps.handlers ?? defaultOutboxHandlers());
  return { ctx, locked, jobIds, outcomes };
}

/** Refuses (409) while uploads of the version are unfinished: they would never become part of it. */
export async function requireNoUnfinishedUploads(versionId: string, doing: string): Promise<void> {
  const names = await listUnfinishedUploads(versionId);
  if (names.length === 0) return;
  const shown = names.slice(0, 5).join(', ') + (names.length > 5 ? ', …' : '');
  throw new AppError('conflict', `Finish or cancel ${plural(names.length, 'upload')} before the version is ${doing}: ${shown}.`, { uploads: names });
}

/** A required free-text field: trimmed, 1..max characters, else 422 with fieldErrors[field]. */
export function requireText(value: unknown, field: string, what: string, max: number): string {
  const text = typeof value === 'string' ? value.trim() : '';
  const fail = (message: string) => new AppError('validation_failed', message, { fieldErrors: { [field]: message } });
  if (!text) throw fail(`Give ${what}; it is required.`);
  if ([...text].length > max) throw fail(`Keep ${what} to ${max} characters or fewer (this one has ${[...text].length}).`);
  return text;
}
