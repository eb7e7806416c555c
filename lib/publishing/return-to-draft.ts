import 'server-only';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { returnedMail } from '@/lib/notify/publishing-mails';
import { listAuthorRecipients } from '@/lib/notify/repo';
import { workspaceUrl } from './urls';
import { FIRST_TRY_HOLD_MS, requireText, runTransition, type ActingUser, type TransitionDeps } from './version-transitions';

export const MAX_REVIEW_COMMENT = 5000;

export type ReturnResult = { versionId: string; state: 'draft'; comment: string; notified: number };

/** in review → draft by a curator or owner ('return_to_draft'), with a comment for the authors (required). */
export async function returnToDraft(
  input: { user: ActingUser | null; versionId: string; comment: unknown },
  deps: TransitionDeps = {},
): Promise<ReturnResult> {
  let comment = '';
  let notified = 0;
  await runTransition(
    {
      user: input.user, versionId: input.versionId, action: 'return_to_draft',
      prepare: async (ctx) => {
        comment = requireText(input.comment, 'comment', 'a comment for the authors', MAX_REVIEW_COMMENT);
        return { authors: await listAuthorRecipients(ctx.version.id) };
      },
      plan: (row, { authors }, ctx, user) => {
        const content = returnedMail({
          title: row.title, versionNumber: row.version_number, groupName: ctx.version.group_name, curatorName: user.name, comment,
          workspaceUrl: workspaceUrl(row.id),
        });
        const jobs = mailJobs(authors, content, { aggregateId: row.id, kind: 'version.returned', holdMs: FIRST_TRY_HOLD_MS });
        notified = jobs.length;
        return {
          patch: { state: 'draft', review_comment: comment },
          audit: { action: 'version.return', actorUserId: user.id, groupId: ctx.version.group_id, details: { comment } },
          jobs,
        };
      },
    },
    deps,
  );
  return { versionId: input.versionId, state: 'draft', comment, notified };
}
