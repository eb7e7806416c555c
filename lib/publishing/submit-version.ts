import 'server-only';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { submittedMail } from '@/lib/notify/publishing-mails';
import { listStewardRecipients } from '@/lib/notify/repo';
import { requireCompleteRecord } from './complete-record';
import { checkEmbargoDate } from './embargo';
import { workspaceUrl } from './urls';
import { FIRST_TRY_HOLD_MS, requireNoUnfinishedUploads, runTransition, type ActingUser, type TransitionDeps } from './version-transitions';

export type SubmitResult = { versionId: string; state: 'in_review'; requestedEmbargoUntil: string | null; notified: number };

/**
 * draft → in review, by any depositor of the group ('submit'). The record must be complete; the author may ask
 * for an embargo date (the curator decides at publication). The group's curators and owners are told by mail.
 */
export async function submitVersion(
  input: { user: ActingUser | null; versionId: string; embargoUntil?: string | null },
  deps: TransitionDeps & { now?: Date } = {},
): Promise<SubmitResult> {
  const now = deps.now ?? new Date();
  let requested: string | null = null;
  let notified = 0;
  await runTransition(
    {
      user: input.user, versionId: input.versionId, action: 'submit',
      prepare: async (ctx, user) => {
        requested = checkEmbargoDate(input.embargoUntil, now);
        await requireNoUnfinishedUploads(ctx.version.id, 'submitted');
        return { stewards: await listStewardRecipients(ctx.version.group_id, user.id) };
      },
      plan: (row, { stewards }, ctx, user) => {
        const record = requireCompleteRecord(row.metadata, 'submitted for review');
        const content = submittedMail({
          title: record.title, versionNumber: row.version_number, groupName: ctx.version.group_name, submitterName: user.name,
          requestedEmbargo: requested, reviewUrl: workspaceUrl(row.id),
        });
        const jobs = mailJobs(stewards, content, { aggregateId: row.id, kind: 'version.submitted', holdMs: FIRST_TRY_HOLD_MS });
        notified = jobs.length;
        return {
          patch: { state: 'in_review', submitted_at: now, requested_embargo_until: requested, review_comment: null, title: record.title },
          audit: { action: 'version.submit', actorUserId: user.id, groupId: ctx.version.group_id, details: { requestedEmbargoUntil: requested } },
          jobs,
        };
      },
    },
    deps,
  );
  return { versionId: input.versionId, state: 'in_review', requestedEmbargoUntil: requested, notified };
}
