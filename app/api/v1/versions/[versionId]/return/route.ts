import schema from '@/schemas/api/return-version.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { readTransitionBody } from '@/lib/publishing/request-body';
import { returnToDraft } from '@/lib/publishing/return-to-draft';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { comment } → 200 { versionId, state: 'draft', comment, notified }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const body = await readTransitionBody<{ comment: string }>(req, schema);
  return Response.json(await returnToDraft({ user, versionId, comment: body.comment }));
});
