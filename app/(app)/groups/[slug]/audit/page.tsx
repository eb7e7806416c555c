import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AuditFilters } from '@/components/audit/audit-filters';
import { AuditTable } from '@/components/audit/audit-table';
import { GroupNav } from '@/components/groups/group-nav';
import { Notice } from '@/components/ui/notice';
import { PageTitle } from '@/components/ui/page-title';
import { listAuditEntries, parseAuditQuery, typedQuery, type AuditPage } from '@/lib/audit/list-audit';
import { AppError } from '@/lib/errors';
import { requireGroup } from '@/lib/groups/require-group';
import { requireSignedIn } from '../../../_auth/require-signed-in';

export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Audit log', robots: { index: false } };

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function GroupAuditPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const user = await requireSignedIn(`/groups/${slug}/audit`);
  const group = await requireGroup(slug).catch((error: unknown) => {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  });
  const path = `/groups/${group.slug}/audit`;
  let page: AuditPage | null = null;
  let problem: AppError | null = null;
  const raw = await searchParams;
  try {
    page = await listAuditEntries({ viewer: user, query: parseAuditQuery({ ...raw, group: group.slug }) });
  } catch (error) {
    if (!(error instanceof AppError) || !['forbidden', 'validation_failed'].includes(error.code)) throw error;
    problem = error;
  }

  if (problem?.code === 'forbidden') {
    return (
      <div className="mx-auto max-w-xl">
        <PageTitle>{group.name}: audit log</PageTitle>
        <Notice tone="info" title="For curators and owners">{problem.message}</Notice>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <div>
        <PageTitle lead="Security-relevant actions in this group: roles and members, invitations, publication and withdrawal, reviewer links. Entries cannot be changed or deleted here.">
          {group.name}
        </PageTitle>
        <GroupNav slug={group.slug} current="audit" showMembers showAudit />
      </div>
      {problem && <Notice tone="error">{problem.message}</Notice>}
      <AuditFilters path={path} query={page?.query ?? typedQuery(raw)} actions={page?.actions ?? []} fieldErrors={problem?.details?.fieldErrors} />
      {page && <AuditTable page={page} path={path} showGroup={false} />}
    </div>
  );
}
