import { curveJsonStream } from '@/lib/compare/curve-json-stream';
import { readFullCurve } from '@/lib/compare/read-full-curve';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/** GET ?x=&y= → { fileId, x, y, xUcum, yUcum, points, xs, ys }: one curve at full resolution in SI (413 above 2 million points). */
export const GET = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  const q = new URL(req.url).searchParams;
  const curve = await readFullCurve({ user: await userFromRequest(req), fileId, x: q.get('x') ?? '', y: q.get('y') ?? '' });
  return new Response(curveJsonStream(curve), { headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'private, no-store' } });
});
