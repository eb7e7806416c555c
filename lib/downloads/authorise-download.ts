import 'server-only';
import { assertAllowed, type Actor, type Resource } from '@/lib/access';
import { recordUsage } from '@/lib/counter/record-usage';
import { viewerFromHeaders } from '@/lib/counter/request-source';
import { loadVersionContext } from '@/lib/datasets/version-access';
import type { VersionRow } from '@/lib/datasets/repo-versions';
import { log } from '@/lib/log';
import { recordLinkUse } from '@/lib/review/record-link-use';
import type { ResolvedLink } from '@/lib/review/resolve-reviewer-link';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

/** Who downloads: a visitor or signed-in user (null = anonymous), or the holder of a resolved reviewer link. */
export type Downloader = { kind: 'user'; user: UserLike } | { kind: 'reviewer'; link: ResolvedLink };

/** The parts of the HTTP request a download reads. */
export type DownloadRequest = { method: string; headers: Headers };

export type DownloadGrant = { version: VersionRow; actor: Actor; resource: Resource };

/**
 * Loads the version and checks 'download_files' at `now` through lib/access: embargo is decided here, at access time;
 * withdrawn versions are refused (all but the site admin); a link for another version is not_found.
 */
export async function authoriseDownload(downloader: Downloader, versionId: string, now: Date): Promise<DownloadGrant> {
  const user = downloader.kind === 'user' ? downloader.user : null;
  const ctx = await loadVersionContext(versionId, user);
  const actor: Actor = downloader.kind === 'reviewer' ? { kind: 'reviewer', link: downloader.link.grant } : ctx.actor;
  assertAllowed(actor, 'download_files', ctx.resource, now);
  return { version: ctx.version, actor, resource: ctx.resource };
}

/**
 * Counts one download as a COUNTER request. Through a reviewer link only the link's use log is written (it records
 * the request with the link, never the reviewer; in anonymous mode not even the client). Never fails the download.
 */
export async function countDownload(args: {
  downloader: Downloader; versionId: string; fileId: string | null; request: DownloadRequest; requestId: string; now: Date;
}): Promise<void> {
  const { downloader, request } = args;
  try {
    if (downloader.kind === 'reviewer') {
      await recordLinkUse({ link: downloader.link, event: 'download', fileId: args.fileId, viewer: viewerFromHeaders(request.headers), now: args.now });
    } else {
      const viewer = viewerFromHeaders(request.headers, downloader.user?.id ?? null);
      await recordUsage({ versionId: args.versionId, kind: 'request', fileId: args.fileId, viewer, now: args.now });
    }
  } catch (error) {
    log('warn', 'could not count a download', { requestId: args.requestId, versionId: args.versionId, error: error instanceof Error ? error.message : String(error) });
  }
}
