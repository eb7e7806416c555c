import { getAnalysis } from '@/lib/analysis/get-analysis';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/** GET → { state, progress, error, summary } for anyone who may view the version's details. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  return Response.json(await getAnalysis({ user: await userFromRequest(req), fileId }));
});
