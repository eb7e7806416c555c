import 'server-only';
import { searchChangedJob } from '@/lib/search/search-changed';
import { DOI_REGISTER_TOPIC } from './register-version-doi';
import { FIRST_TRY_HOLD_MS, requireText, runTransition, type ActingUser, type TransitionDeps } from './version-transitions';

export const MAX_WITHDRAWAL_REASON = 2000;

export type WithdrawResult = { versionId: string; state: 'withdrawn'; reason: string; withdrawnAt: string };

/**
 * published → withdrawn ('withdraw': curators, owners, site admins), with a public reason. The landing page becomes
 * a tombstone and the DOI keeps resolving: its record gains the Withdrawn date and it is hidden from search
 * (state registered) through the 'doi.register' job.
 */
export async function withdrawVersion(
  input: { user: ActingUser | null; versionId: string; reason: unknown },
  deps: TransitionDeps & { now?: Date } = {},
): Promise<WithdrawResult> {
  const now = new Date(Math.floor((deps.now ?? new Date()).getTime() / 1000) * 1000);
  let reason = '';
  await runTransition(
    {
      user: input.user, versionId: input.versionId, action: 'withdraw',
      prepare: async () => {
        reason = requireText(input.reason, 'reason', 'a reason for the withdrawal (it is shown on the tombstone page)', MAX_WITHDRAWAL_REASON);
        return null;
      },
      plan: (row, _prepared, ctx, user) => ({
        patch: { state: 'withdrawn', withdrawn_at: now, withdrawal_reason: reason },
        audit: { action: 'version.withdraw', actorUserId: user.id, groupId: ctx.version.group_id, details: { reason, doi: row.doi } },
        jobs: [{ topic: DOI_REGISTER_TOPIC, aggregateId: row.id, payload: { versionId: row.id }, holdMs: FIRST_TRY_HOLD_MS },
          searchChangedJob(row.dataset_id, row.id)],
      }),
    },
    deps,
  );
  return { versionId: input.versionId, state: 'withdrawn', reason, withdrawnAt: now.toISOString() };
}
