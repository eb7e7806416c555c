import 'server-only';
import { assertAllowed, type Action, type Actor, type Resource, type VersionState } from '@/lib/access';
import { AppError } from '@/lib/errors';
import { groupRoleOf } from '@/lib/groups/repo';
import { findVersionRow, isLatestVersion, type VersionRow } from './repo-versions';

type UserLike = { id: string; siteRole: 'admin' | 'user' } | null;

/** Everything a route needs to decide and act on one dataset version. */
export type VersionContext = { version: VersionRow; actor: Actor; resource: Resource };

export function resourceOf(version: VersionRow, isLatest?: boolean): Resource {
  return {
    versionId: version.id,
    state: version.state as VersionState,
    embargoUntil: version.embargo_until ? new Date(`${version.embargo_until}T00:00:00Z`) : null,
    isLatest,
  };
}

export async function actorFor(user: UserLike, groupId: string): Promise<Actor> {
  if (!user) return { kind: 'anonymous' };
  return { kind: 'user', userId: user.id, siteRole: user.siteRole, groupRole: await groupRoleOf(user.id, groupId) };
}

/** Loads a version and the caller's standing on it; unknown ids are 404 like hidden ones. */
export async function loadVersionContext(versionId: string, user: UserLike): Promise<VersionContext> {
  const version = /^[0-9a-f-]{36}$/i.test(versionId) ? await findVersionRow(versionId) : undefined;
  if (!version) throw new AppError('not_found', 'We could not find this dataset version, or you do not have access to it.');
  const actor = await actorFor(user, version.group_id);
  return { version, actor, resource: resourceOf(version, await isLatestVersion(version)) };
}

/** loadVersionContext + lib/access: throws the access refusal (401/403/404) unless `action` is allowed now. */
export async function requireVersionAction(versionId: string, user: UserLike, action: Action): Promise<VersionContext> {
  const ctx = await loadVersionContext(versionId, user);
  assertAllowed(ctx.actor, action, ctx.resource);
  return ctx;
}
