import 'server-only';
import { allowedActions, type Action } from '@/lib/access';
import { validateTransportDataset, type FieldError } from '@/lib/schema';
import { listFileViews } from '@/lib/uploads/list-files';
import type { DepositUser } from './create-dataset';
import type { VersionRow } from './repo-versions';
import { requireVersionAction } from './version-access';

export type VersionView = {
  version: {
    id: string; datasetId: string; versionNumber: number; state: VersionRow['state']; title: string; doi: string | null;
    doiState: VersionRow['doi_state']; conceptDoi: string | null; group: { slug: string; name: string }; metadata: unknown; updatedAt: string;
  };
  /** What the full schema says about the record (a draft may still be incomplete). */
  validation: { complete: boolean; errors: FieldError[] };
  files: Awaited<ReturnType<typeof listFileViews>>;
  /** Every action the caller may take on this version now (the UI hides only what is refused here). */
  allowedActions: Action[];
};

/** One version as its workspace or API client sees it; refused (401/403/404) unless the caller may view it. */
export async function getVersionView(input: { user: DepositUser | null; versionId: string }): Promise<VersionView> {
  const { version: v, actor, resource } = await requireVersionAction(input.versionId, input.user, 'view_metadata');
  const outcome = validateTransportDataset(v.metadata);
  return {
    version: {
      id: v.id, datasetId: v.dataset_id, versionNumber: v.version_number, state: v.state, title: v.title, doi: v.doi,
      doiState: v.doi_state, conceptDoi: v.concept_doi, group: { slug: v.group_slug, name: v.group_name }, metadata: v.metadata,
      updatedAt: new Date(v.updated_at).toISOString(),
    },
    validation: { complete: outcome.ok, errors: outcome.ok ? [] : outcome.errors },
    files: await listFileViews(v.id),
    allowedActions: allowedActions(actor, resource),
  };
}
