import 'server-only';
import { log } from '@/lib/log';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { embargoEndedMail } from '@/lib/notify/publishing-mails';
import { listAuthorRecipients } from '@/lib/notify/repo';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { utcDay } from './embargo';
import { claimEmbargoNotice, findEmbargoNoticeState, listDueEmbargoNotices } from './repo';
import { versionLandingUrl } from './urls';

/**
 * Queues the "files are open now" mail to the authors if the version's embargo has ended (00:00 UTC of its day)
 * and nobody queued it yet. Cheap when nothing is due (one indexed read), so the landing page calls it on every
 * view; the worker's sweep catches versions nobody visits. The conditional UPDATE lets exactly one caller win.
 */
export async function noteEmbargoEndIfDue(versionId: string, now: Date = new Date()): Promise<boolean> {
  const today = utcDay(now);
  const state = await findEmbargoNoticeState(versionId);
  if (!state || state.state !== 'published' || !state.embargo_until || state.embargo_until > today || state.embargo_notice_sent_at) return false;
  const version = await findVersionRow(versionId);
  if (!version) return false;
  const content = embargoEndedMail({
    title: version.title, versionNumber: version.version_number, groupName: version.group_name, doi: version.doi,
    embargoUntil: state.embargo_until, landingUrl: versionLandingUrl(versionId),
  });
  const jobs = mailJobs(await listAuthorRecipients(versionId), content, { aggregateId: versionId, kind: 'version.embargo_ended' });
  return claimEmbargoNotice(versionId, today, jobs);
}

/** The worker's periodic pass: queues the notice for every version whose embargo ended (at most `limit` a call). */
export async function sweepEndedEmbargoes(now: Date = new Date(), limit = 100): Promise<{ due: number; queued: number }> {
  const ids = await listDueEmbargoNotices(utcDay(now), limit);
  let queued = 0;
  for (const id of ids) {
    try {
      if (await noteEmbargoEndIfDue(id, now)) queued += 1;
    } catch (error) {
      log('warn', 'embargo-ended notice failed; the next sweep retries', { versionId: id, error: error instanceof Error ? error.message : String(error) });
    }
  }
  return { due: ids.length, queued };
}
