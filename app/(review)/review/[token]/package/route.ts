import { downloadPackage } from '@/lib/downloads/download-package';
import { reviewDownload } from '../review-download';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ token: string }> };

/** GET → the link's version as a confidential review package, built for this request; anonymous links leave out every name. */
export async function GET(req: Request, { params }: Ctx): Promise<Response> {
  const { token } = await params;
  return reviewDownload(req, token, (link, requestId) =>
    downloadPackage({ versionId: link.grant.versionId, downloader: { kind: 'reviewer', link }, request: req, requestId }));
}
