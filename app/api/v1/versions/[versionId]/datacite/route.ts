import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';
import { getDataCiteRecord } from '@/lib/publishing/get-datacite-record';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** GET ?format=json (JSON:API "dois" resource) | xml (DataCite 4.7, application/xml); public for published versions. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const format = new URL(req.url).searchParams.get('format');
  const doc = await getDataCiteRecord({ user: await userFromRequest(req), versionId, format });
  return new Response(doc.body, { headers: { 'Content-Type': doc.contentType } });
});
