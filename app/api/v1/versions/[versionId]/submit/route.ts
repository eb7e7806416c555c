import schema from '@/schemas/api/submit-version.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { readTransitionBody } from '@/lib/publishing/request-body';
import { submitVersion } from '@/lib/publishing/submit-version';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { embargoUntil? } → 200 { versionId, state: 'in_review', requestedEmbargoUntil, notified }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const body = await readTransitionBody<{ embargoUntil?: string | null }>(req, schema);
  return Response.json(await submitVersion({ user, versionId, embargoUntil: body.embargoUntil }));
});
