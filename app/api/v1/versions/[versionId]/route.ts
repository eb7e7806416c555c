import { getVersionView } from '@/lib/datasets/get-version-view';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** GET → { version, validation, files, allowedActions }; anyone who may view the version (published ones are public). */
export const GET = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  return Response.json(await getVersionView({ user: await userFromRequest(req), versionId }));
});
