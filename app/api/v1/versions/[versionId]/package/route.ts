import { downloadPackage } from '@/lib/downloads/download-package';
import { replyResponse } from '@/lib/downloads/reply';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/**
 * GET → the version's zip package (a BagIt bag): streamed as it is built, or 302 to a short-lived presigned address
 * once a published version's package is cached. A missing stored file breaks the transfer (never a short zip).
 */
export const GET = route<Ctx>(async (req, { params, requestId }) => {
  const { versionId } = await params;
  const user = await userFromRequest(req);
  return replyResponse(await downloadPackage({ versionId, downloader: { kind: 'user', user }, request: req, requestId }));
});
