import schema from '@/schemas/api/create-reviewer-link.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { createReviewerLink, type CreateLinkInput } from '@/lib/review/create-reviewer-link';
import { listReviewerLinks } from '@/lib/review/list-reviewer-links';
import { readLinkBody } from '@/lib/review/read-body';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { label, expiresAt?, anonymous? } → 201 { link, token, url }; the token is shown only in this answer. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const input = await readLinkBody<CreateLinkInput>(req, schema);
  return Response.json(await createReviewerLink({ user, versionId, input }), { status: 201, headers: { 'cache-control': 'no-store' } });
});

/** GET → { links: [...] } with use counts, for the version's group. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  return Response.json({ links: await listReviewerLinks({ user, versionId }) });
});
