import 'server-only';
import { PERMISSIONS, PHASES, principalsOf, type Actor } from '@/lib/access';
import { actorFor } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';
import { findGroupBySlug } from '@/lib/groups/repo';
import { groupUsageRows, versionUsageRow } from './repo';
import { addTotals, NO_USAGE, totalsFromRow, type UsageTotals } from './usage-totals';

export type { UsageTotals };

/**
 * COUNTER totals of one version for its landing page (robots and double-clicks excluded). No access check here:
 * the landing page shows them to whoever it already lets see the version.
 */
export async function getVersionUsage(versionId: string): Promise<UsageTotals> {
  return totalsFromRow(await versionUsageRow(versionId));
}

export type VersionUsage = { versionId: string; datasetId: string; versionNumber: number; title: string; state: string; usage: UsageTotals };
export type GroupUsage = { group: { slug: string; name: string }; from: string | null; to: string | null; versions: VersionUsage[]; totals: UsageTotals };

/** view_access_log is a group-level action: the same stewards in every phase of the table, so any phase answers. */
function mayReadGroupUsage(actor: Actor): boolean {
  const principals = principalsOf(actor);
  return PHASES.every((phase) => principals.some((p) => PERMISSIONS[phase].view_access_log.includes(p)));
}

/** Per-version and total COUNTER metrics of a group's datasets in [from, to), for its curators and owners (and site admins). */
export async function getGroupUsage(args: {
  user: { id: string; siteRole: 'admin' | 'user' } | null; groupSlug: string; from?: Date | null; to?: Date | null;
}): Promise<GroupUsage> {
  const group = await findGroupBySlug(args.groupSlug);
  if (!group) throw new AppError('not_found', 'We could not find this group.');
  const actor = await actorFor(args.user, group.id);
  if (!mayReadGroupUsage(actor)) {
    if (actor.kind === 'anonymous') throw new AppError('not_signed_in', 'Sign in to see how the group’s datasets are used.');
    throw new AppError('forbidden', 'Only the group’s curators and owners can see how its datasets are used.');
  }
  const rows = await groupUsageRows(group.id, args.from ?? null, args.to ?? null);
  const versions = rows.map((r) => ({
    versionId: r.version_id, datasetId: r.dataset_id, versionNumber: Number(r.version_number), title: r.title, state: r.state, usage: totalsFromRow(r),
  }));
  return {
    group: { slug: group.slug, name: group.name },
    from: args.from ? args.from.toISOString() : null,
    to: args.to ? args.to.toISOString() : null,
    versions,
    totals: versions.reduce((sum, v) => addTotals(sum, v.usage), NO_USAGE),
  };
}
