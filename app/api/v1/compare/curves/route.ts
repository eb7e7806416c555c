import { parseCurveRefs } from '@/lib/compare/parse-curve-refs';
import { resolveCurves } from '@/lib/compare/resolve-curves';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** GET ?curves=[{versionId, fileId, x, y}, …] → { entries, unavailable }: a browser-kept basket resolved for whoever asks. */
export const GET = route(async (req) => {
  const refs = parseCurveRefs(new URL(req.url).searchParams.get('curves'));
  return Response.json(await resolveCurves(await userFromRequest(req), refs.map((ref) => ({ ref }))));
});
