import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { getLinkAccessLog } from '@/lib/review/list-reviewer-links';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** GET → { events: [{ at, event, linkId, linkLabel, counted, robot }] }, newest first; for the group's stewards. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  return Response.json({ events: await getLinkAccessLog({ user, versionId }) });
});
