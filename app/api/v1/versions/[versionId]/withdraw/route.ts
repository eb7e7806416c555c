import schema from '@/schemas/api/withdraw-version.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { readTransitionBody } from '@/lib/publishing/request-body';
import { withdrawVersion } from '@/lib/publishing/withdraw-version';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { reason } → 200 { versionId, state: 'withdrawn', reason, withdrawnAt }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const body = await readTransitionBody<{ reason: string }>(req, schema);
  return Response.json(await withdrawVersion({ user, versionId, reason: body.reason }));
});
