import 'server-only';
import { randomUUID } from 'node:crypto';
import schema from '@/schemas/api/create-dataset.schema.json';
import type { SiteRole } from '@/lib/access';
import type { DoiClient } from '@/lib/doi/client';
import { newDoi } from '@/lib/doi/doi-suffix';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { findGroupBySlug, groupRoleOf } from '@/lib/groups/repo';
import { log } from '@/lib/log';
import { defaultOutboxHandlers, tryOutboxJobNow } from '@/lib/outbox/process-outbox';
import { validateWith } from '@/lib/validation/validate';
import { insertDraftDataset } from './repo';
import { findVersionRow } from './repo-versions';

/** Who deposits: a signed-in user (session or, later, API token). */
export type DepositUser = { id: string; name: string; siteRole: SiteRole };
export type CreateDatasetBody = { group: string; title: string };
export type CreatedDataset = {
  datasetId: string; versionId: string; versionNumber: 1; doi: string; conceptDoi: string; doiState: 'none' | 'reserved';
};

const MAX_TITLE = schema.properties.title.maxLength;
/** Workers leave a new job alone this long, while the request tries the reservation itself. */
const FIRST_TRY_HOLD_MS = 60_000;

/** Validates POST /api/v1/datasets (and the deposit form): the title is trimmed, then 1–300 characters. */
export function parseCreateDatasetBody(body: unknown): CreateDatasetBody {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw new AppError('validation_failed', 'Send a JSON object with "group" (the group\'s slug) and "title".');
  }
  const input = body as Record<string, unknown>;
  const title = typeof input.title === 'string' ? input.title.trim() : input.title;
  const parsed = validateWith<CreateDatasetBody>(schema, { ...input, title });
  if (parsed.ok) return parsed.value;
  const fieldErrors = { ...parsed.fieldErrors };
  if (title === '') fieldErrors.title = 'Give the dataset a title.';
  else if (typeof title === 'string' && [...title].length > MAX_TITLE) {
    fieldErrors.title = `Keep the title to ${MAX_TITLE} characters or fewer (this one has ${[...title].length}).`;
  }
  throw new AppError('validation_failed', 'Please correct the highlighted fields.', { fieldErrors });
}

/**
 * Starts a dataset in a group the user deposits for: draft version 1 with fresh version and all-versions DOIs,
 * reserved as drafts at the agency right away when it answers, else later by the outbox.
 */
export async function createDataset(
  input: { user: DepositUser; groupSlug: string; title: string },
  deps: { doi?: DoiClient } = {},
): Promise<CreatedDataset> {
  const { user } = input;
  const { group: groupSlug, title } = parseCreateDatasetBody({ group: input.groupSlug, title: input.title });
  const group = await findGroupBySlug(groupSlug);
  if (!group) throw new AppError('not_found', `There is no group "${groupSlug}".`, { fieldErrors: { group: 'Choose one of your groups.' } });
  const role = await groupRoleOf(user.id, group.id);
  if (!role && user.siteRole !== 'admin') {
    throw new AppError('forbidden', `Only members, curators and owners of ${group.name} can start a dataset there.`);
  }

  const prefix = env().DOI_PREFIX;
  const created = { datasetId: randomUUID(), versionId: randomUUID(), doi: newDoi(prefix), conceptDoi: newDoi(prefix) };
  const outboxId = await insertDraftDataset(
    { ...created, groupId: group.id, userId: user.id, title, metadata: { title, creators: [{ name: user.name }] } },
    { holdMs: FIRST_TRY_HOLD_MS },
  );

  try {
    await tryOutboxJobNow(outboxId, defaultOutboxHandlers({ doi: deps.doi }));
  } catch (error) {
    // The dataset is committed; the outbox job stays due and a worker finishes the reservation.
    log('warn', 'first DOI reservation try failed', { versionId: created.versionId, error: error instanceof Error ? error.message : String(error) });
  }
  const version = await findVersionRow(created.versionId);
  return { ...created, versionNumber: 1, doiState: version?.doi_state === 'reserved' ? 'reserved' : 'none' };
}
