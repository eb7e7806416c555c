import { addCompareItems } from '@/lib/compare/add-compare-items';
import { getCompareBasket } from '@/lib/compare/get-compare-basket';
import { removeCompareItems } from '@/lib/compare/remove-compare-items';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** GET → { entries, unavailable, max }: the signed-in user's basket, each curve checked for access now. */
export const GET = route(async (req) => {
  return Response.json(await getCompareBasket({ user: await requireRequestUser(req) }));
});

/** POST { versionId?, fileId?, x?, y? } or { items: [...] } → 201 { items, rejected, count, max }; 409 when the basket is full. */
export const POST = route(async (req) => {
  const user = await requireRequestUser(req);
  const result = await addCompareItems({ user, input: await readJsonBody(req, 64 * 1024) });
  return Response.json(result, { status: result.items.some((i) => i.outcome === 'added') ? 201 : 200 });
});

/** DELETE ?id=<item id> or ?all=true → { removed }. */
export const DELETE = route(async (req) => {
  const user = await requireRequestUser(req);
  const q = new URL(req.url).searchParams;
  return Response.json(await removeCompareItems({ user, id: q.get('id'), all: q.get('all') === 'true' }));
});
