import { readJsonBody } from '@/lib/datasets/read-json-body';
import { AppError } from '@/lib/errors';
import { getMembersView } from '@/lib/groups/get-members-view';
import { inviteMember } from '@/lib/groups/invite-member';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string }> };

/** GET → 200 { invitations: [{ id, email, role, status, expiresAt, invitedBy, createdAt }] }; curators, owners, site admins. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  const view = await getMembersView({ user: await requireRequestUser(req), slug });
  if (!view.can.invite) throw new AppError('forbidden', `Only curators and owners of ${view.group.name} see its invitations.`);
  return Response.json({ invitations: view.invitations });
});

/** POST { email, role } → 201 { invitation, delivery: 'sent' | 'queued', replaced }; the link goes only to the address. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await inviteMember({ user, slug, input: await readJsonBody(req, 4 * 1024) }), { status: 201 });
});
