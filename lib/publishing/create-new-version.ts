import 'server-only';
import { randomUUID } from 'node:crypto';
import { findVersionRow } from '@/lib/datasets/repo-versions';
import { requireVersionAction } from '@/lib/datasets/version-access';
import type { DoiClient } from '@/lib/doi/client';
import { newDoi } from '@/lib/doi/doi-suffix';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { defaultOutboxHandlers } from '@/lib/outbox/process-outbox';
import { insertNextVersion } from './repo-transitions';
import { FIRST_TRY_HOLD_MS, tryJobsNow, type ActingUser } from './version-transitions';

export type NewVersionResult = {
  datasetId: string; versionId: string; versionNumber: number; doi: string; doiState: 'none' | 'reserved'; fileCount: number;
};

/**
 * Starts draft v(n+1) from the dataset's latest published version ('create_version': any depositor of the group):
 * same metadata, new file rows that point at the same stored blobs (nothing is copied in storage), and a fresh
 * version DOI reserved as a draft through the 'doi.reserve' job.
 */
export async function createNewVersion(
  input: { user: ActingUser | null; versionId: string },
  deps: { doi?: DoiClient } = {},
): Promise<NewVersionResult> {
  const { version } = await requireVersionAction(input.versionId, input.user, 'create_version');
  // Unreachable: the table grants create_version to group depositors only; this narrows the type.
  if (!input.user) throw new AppError('not_signed_in', 'Sign in to start a new version.');
  const versionId = randomUUID();
  const doi = newDoi(env().DOI_PREFIX);
  const created = await insertNextVersion({
    sourceVersionId: version.id, newVersionId: versionId, doi, userId: input.user.id, groupId: version.group_id, holdMs: FIRST_TRY_HOLD_MS,
  });
  await tryJobsNow([created.outboxId], defaultOutboxHandlers({ doi: deps.doi }));
  const after = await findVersionRow(versionId);
  return {
    datasetId: version.dataset_id, versionId, versionNumber: created.versionNumber, doi, doiState: after?.doi_state === 'reserved' ? 'reserved' : 'none',
    fileCount: created.fileCount,
  };
}
