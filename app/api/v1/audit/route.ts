import { listAuditEntries, parseAuditQuery } from '@/lib/audit/list-audit';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/**
 * GET ?group=&action=&actor=&targetType=&targetId=&from=&to=&page=&pageSize= → 200 { scope, entries, total, page,
 * pageSize, pageCount, actions }. Curators and owners name their group; site admins may leave it out.
 */
export const GET = route(async (req) => {
  const viewer = await requireRequestUser(req);
  return Response.json(await listAuditEntries({ viewer, query: parseAuditQuery(new URL(req.url).searchParams) }));
});
