import { route } from '@/lib/http/handler';
import { parseSearchQuery } from '@/lib/search/parse-query';
import { searchPublished } from '@/lib/search/search-service';

export const dynamic = 'force-dynamic';

/** GET /api/v1/search — published versions by text, facets and ranges (see schemas/api/search-query.schema.json). */
export const GET = route(async (req) => {
  const query = parseSearchQuery(new URL(req.url).searchParams);
  return Response.json(await searchPublished(query), { headers: { 'cache-control': 'no-store' } });
});
