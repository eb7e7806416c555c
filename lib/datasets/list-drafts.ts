import 'server-only';
import { listDraftRowsForMember } from './repo';

export type DraftSummary = {
  versionId: string; datasetId: string; title: string; versionNumber: number; groupSlug: string; groupName: string;
  /** ISO 8601 instant (UTC). */
  updatedAt: string;
  /** Verified files only; uploads still in progress are not counted. */
  fileCount: number;
};

/** Drafts of every group the user belongs to (any depositor of a group may edit its drafts), newest first. */
export async function listDrafts(user: { id: string }): Promise<DraftSummary[]> {
  const rows = await listDraftRowsForMember(user.id);
  return rows.map((r) => ({
    versionId: r.version_id, datasetId: r.dataset_id, title: r.title, versionNumber: r.version_number, groupSlug: r.group_slug,
    groupName: r.group_name, updatedAt: new Date(r.updated_at).toISOString(), fileCount: Number(r.file_count),
  }));
}
