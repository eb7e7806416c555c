import 'server-only';
import { searchChangedJob } from '@/lib/search/search-changed';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { AppError } from '@/lib/errors';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { approvedMail } from '@/lib/notify/publishing-mails';
import { listAuthorRecipients } from '@/lib/notify/repo';
import { requireCompleteRecord } from './complete-record';
import { checkEmbargoDate } from './embargo';
import { DOI_REGISTER_TOPIC } from './register-version-doi';
import { versionLandingUrl } from './urls';
import { FIRST_TRY_HOLD_MS, requireNoUnfinishedUploads, runTransition, type ActingUser, type TransitionDeps } from './version-transitions';

export type PublishResult = {
  versionId: string; state: 'published'; doi: string; doiState: 'pending' | 'findable'; embargoUntil: string | null; publishedAt: string;
};

/**
 * Publishes a version (curators and owners: 'publish'; from in review, or straight from draft where the table
 * allows it). `embargoUntil`: undefined keeps the author's requested date, null publishes without embargo, a
 * date replaces it. The record must be complete. The intent is committed first (state, version_publications,
 * 'doi.register' job); registration is then tried at once and retried by the outbox until the agency answers.
 */
export async function publishVersion(
  input: { user: ActingUser | null; versionId: string; embargoUntil?: string | null },
  deps: TransitionDeps & { now?: Date } = {},
): Promise<PublishResult> {
  // Whole seconds: published_at is a DATETIME, and the answer should match what is stored.
  const now = new Date(Math.floor((deps.now ?? new Date()).getTime() / 1000) * 1000);
  let embargoUntil: string | null = null;
  let doi = '';
  await runTransition(
    {
      user: input.user, versionId: input.versionId, action: 'publish',
      prepare: async (ctx) => {
        if (input.embargoUntil !== undefined) checkEmbargoDate(input.embargoUntil, now);
        await requireNoUnfinishedUploads(ctx.version.id, 'published');
        return { authors: await listAuthorRecipients(ctx.version.id) };
      },
      plan: (row, { authors }, ctx, user) => {
        embargoUntil = input.embargoUntil !== undefined ? checkEmbargoDate(input.embargoUntil, now) : checkEmbargoDate(row.requested_embargo_until, now);
        const record = requireCompleteRecord(row.metadata, 'published');
        if (!row.doi) throw new AppError('conflict', 'This version has no DOI to register; ask the site admin.');
        doi = row.doi;
        const mails = mailJobs(
          authors,
          approvedMail({
            title: record.title, versionNumber: row.version_number, groupName: ctx.version.group_name, curatorName: user.name, doi,
            embargoUntil, landingUrl: versionLandingUrl(row.id),
          }),
          { aggregateId: row.id, kind: 'version.approved', holdMs: FIRST_TRY_HOLD_MS },
        );
        return {
          patch: {
            state: 'published', published_at: now, embargo_until: embargoUntil, approved_by: user.id, doi_state: 'pending', title: record.title,
            review_comment: null,
          },
          publication: { approvedBy: user.id, embargoUntil },
          audit: {
            action: 'version.publish', actorUserId: user.id, groupId: ctx.version.group_id,
            details: { fromState: row.state, doi, embargoUntil, requestedEmbargoUntil: row.requested_embargo_until },
          },
          // Registration first: the mails then go out whether or not the agency answered.
          jobs: [{ topic: DOI_REGISTER_TOPIC, aggregateId: row.id, payload: { versionId: row.id }, holdMs: FIRST_TRY_HOLD_MS }, ...mails,
            searchChangedJob(row.dataset_id, row.id)],
        };
      },
    },
    deps,
  );
  const after = await findVersionRow(input.versionId);
  return {
    versionId: input.versionId, state: 'published', doi, doiState: after?.doi_state === 'findable' ? 'findable' : 'pending', embargoUntil,
    publishedAt: now.toISOString(),
  };
}
