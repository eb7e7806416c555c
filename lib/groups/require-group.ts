import 'server-only';
import { AppError } from '@/lib/errors';
import { findGroupBySlug, type GroupRow } from './repo';

/** The group with this address, or 404. Groups are public, so saying one does not exist hides nothing. */
export async function requireGroup(slug: string): Promise<GroupRow> {
  const group = typeof slug === 'string' && slug.length <= 80 ? await findGroupBySlug(slug) : undefined;
  if (!group) throw new AppError('not_found', `There is no group at /groups/${String(slug).slice(0, 80)}.`);
  return group;
}

export function requireSignedIn<U>(user: U | null, doing: string): U {
  if (!user) throw new AppError('not_signed_in', `Sign in to ${doing}.`);
  return user;
}
