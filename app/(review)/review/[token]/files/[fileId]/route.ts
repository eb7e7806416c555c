import { downloadFile } from '@/lib/downloads/download-file';
import { reviewDownload } from '../../review-download';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ token: string; fileId: string }> };

/** GET → one file of the link's version (Range as on the public route); counted only in the link's use log. */
export async function GET(req: Request, { params }: Ctx): Promise<Response> {
  const { token, fileId } = await params;
  return reviewDownload(req, token, (link, requestId) => downloadFile({ fileId, downloader: { kind: 'reviewer', link }, request: req, requestId }));
}
