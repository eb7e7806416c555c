import { revokeInvitation } from '@/lib/groups/revoke-invitation';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string; invitationId: string }> };

/** DELETE → 200 { revoked: true }; the link stops working at once. 404 when it was already answered or withdrawn. */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { slug, invitationId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await revokeInvitation({ user, slug, invitationId }));
});
