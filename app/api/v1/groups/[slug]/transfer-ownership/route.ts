import { readJsonBody } from '@/lib/datasets/read-json-body';
import { transferOwnership } from '@/lib/groups/transfer-ownership';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string }> };

/** POST { userId, formerOwnerRole? } → 200 { newOwner, formerOwner }; owners only. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await transferOwnership({ user, slug, input: await readJsonBody(req, 4 * 1024) }));
});
