import { listDrafts } from '@/lib/datasets/list-drafts';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** GET → { drafts }: the drafts of every group the caller belongs to, newest first. */
export const GET = route(async (req) => {
  const user = await requireRequestUser(req);
  return Response.json({ drafts: await listDrafts(user) });
});
