import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';
import { getCitation } from '@/lib/publishing/get-citation';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** GET ?format=text (default) | bibtex | ris | csl-json → the citation in that format's media type. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const format = new URL(req.url).searchParams.get('format');
  const doc = await getCitation({ user: await userFromRequest(req), versionId, format });
  return new Response(doc.body, { headers: { 'Content-Type': doc.contentType } });
});
