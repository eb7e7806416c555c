import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { revokeReviewerLink } from '@/lib/review/revoke-reviewer-link';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ linkId: string }> };

/** DELETE → 200 { link } with status 'revoked'; the link stops working at once. Repeating it changes nothing. */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { linkId } = await params;
  const user = await requireRequestUser(req);
  return Response.json({ link: await revokeReviewerLink({ user, linkId }) });
});
