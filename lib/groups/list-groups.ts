import 'server-only';
import type { GroupRole } from '@/lib/access';
import type { GroupActor } from './group-access';
import { groupStorage, type GroupStorage } from './group-storage';
import { countsOfGroup, groupRoleOf, groupsOfUser, listGroups, listPublishedDatasets } from './repo';
import { requireGroup } from './require-group';

export type GroupSummary = {
  slug: string; name: string; institution: string | null; description: string | null; memberCount: number; datasetCount: number;
  /** The caller's role; null when not a member. */
  yourRole: GroupRole | null;
};
export type PublishedDatasetItem = {
  datasetId: string; title: string; versionNumber: number; doi: string | null; publishedAt: string | null; embargoUntil: string | null; url: string;
};
export type GroupDetail = GroupSummary & { datasets: PublishedDatasetItem[]; storage: GroupStorage | null };

/** Every group, by name, with the caller's role in each (GET /api/v1/groups). */
export async function listGroupSummaries(user: GroupActor | null): Promise<GroupSummary[]> {
  const [groups, mine] = await Promise.all([listGroups(), user ? groupsOfUser(user.id) : Promise.resolve([])]);
  const roles = new Map(mine.map((g) => [g.id, g.role]));
  return groups.map((g) => ({
    slug: g.slug, name: g.name, institution: g.institution, description: g.description,
    memberCount: Number(g.member_count), datasetCount: Number(g.dataset_count), yourRole: roles.get(g.id) ?? null,
  }));
}

/** One group with its published datasets; storage only for its members and site admins (GET /api/v1/groups/{slug}). */
export async function getGroupDetail(args: { user: GroupActor | null; slug: string }): Promise<GroupDetail> {
  const group = await requireGroup(args.slug);
  const [counts, datasets, yourRole] = await Promise.all([
    countsOfGroup(group.id), listPublishedDatasets(group.id), args.user ? groupRoleOf(args.user.id, group.id) : Promise.resolve(undefined),
  ]);
  const insider = Boolean(args.user && (yourRole || args.user.siteRole === 'admin'));
  return {
    slug: group.slug, name: group.name, institution: group.institution, description: group.description, ...counts, yourRole: yourRole ?? null,
    datasets: datasets.map((d) => ({
      datasetId: d.dataset_id, title: d.title, versionNumber: d.version_number, doi: d.doi,
      publishedAt: d.published_at ? new Date(d.published_at).toISOString() : null, embargoUntil: d.embargo_until, url: `/datasets/${d.dataset_id}`,
    })),
    storage: insider ? groupStorage(group) : null,
  };
}
