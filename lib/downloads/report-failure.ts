import 'server-only';
import { recordAudit } from '@/lib/audit/record-audit';
import { log } from '@/lib/log';
import type { Downloader } from './authorise-download';

export type DownloadFailure = {
  action: 'package.failed' | 'file.download_failed';
  requestId: string;
  downloader: Downloader;
  groupId: string;
  versionId: string;
  fileId?: string | null;
  error: Error;
};

/** Logs a download that storage could not complete (with the request id) and keeps an audit entry; never throws. */
export async function reportDownloadFailure(f: DownloadFailure): Promise<void> {
  const fields = { requestId: f.requestId, versionId: f.versionId, fileId: f.fileId ?? null, error: f.error.message, errorName: f.error.name };
  log('error', f.action === 'package.failed' ? 'package download failed' : 'file download failed', fields);
  const d = f.downloader;
  const reviewer = d.kind === 'reviewer';
  const userId = d.kind === 'user' ? (d.user?.id ?? null) : null;
  try {
    await recordAudit({
      action: f.action, actorKind: reviewer ? 'reviewer' : userId ? 'user' : 'anonymous', actorUserId: userId, groupId: f.groupId,
      targetType: 'dataset_version', targetId: f.versionId,
      details: { requestId: f.requestId, fileId: f.fileId ?? null, error: f.error.message, ...(d.kind === 'reviewer' ? { reviewerLinkId: d.link.linkId } : {}) },
    });
  } catch (error) {
    log('error', 'could not audit a failed download', { requestId: f.requestId, error: error instanceof Error ? error.message : String(error) });
  }
}
