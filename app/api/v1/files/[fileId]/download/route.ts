import { downloadFile } from '@/lib/downloads/download-file';
import { replyResponse } from '@/lib/downloads/reply';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/**
 * GET (HEAD: headers only) → the file's bytes, streamed from storage. Range bytes=a-b | a- | -n → 206, unsatisfiable
 * → 416, several ranges → 200 with the whole file. ETag is the SHA-256; 403 while embargoed for outsiders.
 */
export const GET = route<Ctx>(async (req, { params, requestId }) => {
  const { fileId } = await params;
  const user = await userFromRequest(req);
  return replyResponse(await downloadFile({ fileId, downloader: { kind: 'user', user }, request: req, requestId }));
});
