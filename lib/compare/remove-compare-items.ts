import 'server-only';
import { AppError } from '@/lib/errors';
import { deleteAllCompareItems, deleteCompareItem } from './repo';

type UserLike = { id: string; siteRole: 'admin' | 'user' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Removes one item (`id`) or, with `all`, every item of the user's basket; an id that is not the user's is 404. */
export async function removeCompareItems(args: { user: UserLike; id: string | null; all: boolean }): Promise<{ removed: number }> {
  if (args.all && args.id === null) return { removed: await deleteAllCompareItems(args.user.id) };
  if (args.id === null || args.all) {
    throw new AppError('validation_failed', 'Name the item to remove (?id=…), or ?all=true to empty the basket.', { fieldErrors: { id: 'Give one of id or all.' } });
  }
  if (!UUID.test(args.id) || !(await deleteCompareItem(args.user.id, args.id))) {
    throw new AppError('not_found', 'This curve is not in your compare basket (any more).');
  }
  return { removed: 1 };
}
