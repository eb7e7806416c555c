import { readJsonBody } from '@/lib/datasets/read-json-body';
import { createGroup } from '@/lib/groups/create-group';
import { listGroupSummaries } from '@/lib/groups/list-groups';
import { route } from '@/lib/http/handler';
import { requireRequestUser, userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** GET → 200 { groups: [{ slug, name, institution, description, memberCount, datasetCount, yourRole }] }; public. */
export const GET = route(async (req) => {
  return Response.json({ groups: await listGroupSummaries(await userFromRequest(req)) });
});

/** POST { name, slug?, institution?, description? } → 201 { id, slug, name }; the caller becomes the owner. */
export const POST = route(async (req) => {
  const user = await requireRequestUser(req);
  return Response.json(await createGroup({ user, input: await readJsonBody(req, 16 * 1024) }), { status: 201 });
});
