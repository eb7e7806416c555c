import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { GroupDatasets } from '@/components/groups/group-datasets';
import { GroupNav } from '@/components/groups/group-nav';
import { RoleBadge } from '@/components/groups/role-badge';
import { StorageBar } from '@/components/groups/storage-bar';
import { PageTitle } from '@/components/ui/page-title';
import { currentUser } from '@/lib/auth/session';
import { mayInGroup } from '@/lib/groups/group-access';
import { getGroupDetail, type GroupDetail } from '@/lib/groups/list-groups';
import { findGroupBySlug, listMembers } from '@/lib/groups/repo';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const group = await findGroupBySlug((await params).slug);
  return { title: group?.name ?? 'Group not found' };
}

export default async function GroupPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const group = await findGroupBySlug(slug);
  if (!group) notFound();
  const user = await currentUser();
  const [detail, members]: [GroupDetail, Awaited<ReturnType<typeof listMembers>>] = await Promise.all([getGroupDetail({ user, slug }), listMembers(group.id)]);
  const insider = Boolean(user && (detail.yourRole || user.siteRole === 'admin'));
  const showAudit = Boolean(user && mayInGroup(user, detail.yourRole ?? undefined, 'view_access_log'));
  return (
    <div className="flex flex-col gap-8">
      <div>
        <PageTitle lead={group.description}>{group.name}</PageTitle>
        {group.institution && <p className="-mt-4 mb-4 text-sm text-slate-600">{group.institution}</p>}
        {insider && <GroupNav slug={group.slug} current="page" showMembers showAudit={showAudit} />}
      </div>

      {detail.storage && <StorageBar storage={detail.storage} groupName={group.name} />}

      <section aria-labelledby="datasets-heading">
        <h2 id="datasets-heading" className="mb-2 text-lg font-semibold">Published datasets ({detail.datasets.length})</h2>
        <GroupDatasets datasets={detail.datasets} groupName={group.name} />
      </section>

      <section aria-labelledby="members-heading">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="members-heading" className="text-lg font-semibold">Members</h2>
          {insider && <Link href={`/groups/${group.slug}/members`} className="text-sm font-semibold text-copper-700 underline">Manage members and invitations</Link>}
        </div>
        <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
          {members.map((m) => (
            <li key={m.user_id} className="flex items-center justify-between gap-2 px-4 py-2 text-sm">
              <span>{m.name}{m.orcid && <span className="ml-2 font-mono text-xs text-slate-500">ORCID {m.orcid}</span>}</span>
              <RoleBadge role={m.role} />
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
