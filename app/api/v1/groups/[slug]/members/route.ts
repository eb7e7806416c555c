import { getMembersView } from '@/lib/groups/get-members-view';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string }> };

/** GET → 200 { access, yourRole, members }: names and roles for everyone; addresses and join dates for insiders. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  const view = await getMembersView({ user: await userFromRequest(req), slug });
  return Response.json({ group: { slug: view.group.slug, name: view.group.name }, access: view.access, yourRole: view.viewerRole, members: view.members });
});
