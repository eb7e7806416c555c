import 'server-only';
import type { FileSummary } from '@/lib/transport/summary';
import { fileGone, loadFileFor } from '@/lib/uploads/load-file';
import { findAnalysis, type AnalysisRow } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

export type AnalysisView = { state: AnalysisRow['state']; progress: number; error: string | null; summary: FileSummary | null };

/** A file's analysis for whoever may see the version's details: state, progress 0..1, the plain error, the summary. */
export async function getAnalysis(args: { user: UserLike; fileId: string }): Promise<AnalysisView> {
  const { file } = await loadFileFor(args.fileId, args.user, 'view_metadata');
  const row = await findAnalysis(file.id);
  if (!row) throw fileGone();
  return {
    state: row.state,
    progress: Math.min(1, Math.max(0, row.progress)),
    error: row.state === 'failed' ? row.error : null,
    summary: (row.summary as FileSummary | null) ?? null,
  };
}
