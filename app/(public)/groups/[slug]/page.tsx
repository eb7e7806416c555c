import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageTitle } from '@/components/ui/page-title';
import { RoleBadge } from '@/components/groups/role-badge';
import { findGroupBySlug, listMembers } from '@/lib/groups/repo';
import { formatBytes } from '@/lib/format/bytes';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const group = await findGroupBySlug((await params).slug);
  return { title: group?.name ?? 'Group not found' };
}

export default async function GroupPage({ params }: { params: Promise<{ slug: string }> }) {
  const group = await findGroupBySlug((await params).slug);
  if (!group) notFound();
  const members = await listMembers(group.id);
  return (
    <div>
      <PageTitle lead={group.description}>{group.name}</PageTitle>
      <p className="mb-6 text-sm text-slate-600">{group.institution} · storage {formatBytes(Number(group.storage_used_bytes))} of {formatBytes(Number(group.storage_quota_bytes))}</p>
      <h2 className="mb-2 text-lg font-semibold">Members</h2>
      <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
        {members.map((m) => (
          <li key={m.user_id} className="flex items-center justify-between px-4 py-2 text-sm">
            <span>{m.name}{m.orcid && <span className="ml-2 font-mono text-xs text-slate-500">ORCID {m.orcid}</span>}</span>
            <RoleBadge role={m.role} />
          </li>
        ))}
      </ul>
    </div>
  );
}
