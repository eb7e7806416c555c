import { readJsonBody } from '@/lib/datasets/read-json-body';
import { changeMemberRole } from '@/lib/groups/change-role';
import { removeMember } from '@/lib/groups/remove-member';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string; userId: string }> };

/** PATCH { role } → 200 { member, from, changed }; owners and site admins; 409 when the group would have no owner. */
export const PATCH = route<Ctx>(async (req, { params }) => {
  const { slug, userId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await changeMemberRole({ user, slug, userId, input: await readJsonBody(req, 4 * 1024) }));
});

/** DELETE → 200 { userId, role, left }; owners remove anyone, everyone may remove themselves (leave). */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { slug, userId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await removeMember({ user, slug, userId }));
});
