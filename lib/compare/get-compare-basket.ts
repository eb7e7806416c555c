import 'server-only';
import { MAX_COMPARE_CURVES } from './basket-limits';
import { listCompareItems } from './repo';
import { resolveCurves } from './resolve-curves';
import type { ResolvedBasket } from './types';

type UserLike = { id: string; siteRole: 'admin' | 'user' };

export type CompareBasket = ResolvedBasket & { max: number };

/**
 * The signed-in user's basket, every curve checked against lib/access now: an item whose version was withdrawn, put
 * under embargo or whose file went comes back in `unavailable` with the reason (keyed by item id, so it can go).
 */
export async function getCompareBasket(args: { user: UserLike }): Promise<CompareBasket> {
  const rows = await listCompareItems(args.user.id);
  const resolved = await resolveCurves(args.user, rows.map((r) => ({ key: r.id, ref: { versionId: r.versionId, fileId: r.fileId, x: r.x, y: r.y } })));
  return { ...resolved, max: MAX_COMPARE_CURVES };
}
