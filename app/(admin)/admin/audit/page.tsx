import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AuditFilters } from '@/components/audit/audit-filters';
import { AuditTable } from '@/components/audit/audit-table';
import { Notice } from '@/components/ui/notice';
import { PageTitle } from '@/components/ui/page-title';
import { listAuditEntries, parseAuditQuery, typedQuery, type AuditPage } from '@/lib/audit/list-audit';
import { currentUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { listGroups } from '@/lib/groups/repo';

export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Audit log (all groups)', robots: { index: false } };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function AdminAuditPage({ searchParams }: Props) {
  const user = await currentUser();
  if (user?.siteRole !== 'admin') notFound();
  const path = '/admin/audit';
  let page: AuditPage | null = null;
  let problem: AppError | null = null;
  const raw = await searchParams;
  try {
    page = await listAuditEntries({ viewer: user, query: parseAuditQuery(raw) });
  } catch (error) {
    if (!(error instanceof AppError) || !['validation_failed', 'not_found'].includes(error.code)) throw error;
    problem = error;
  }
  const groups = (await listGroups()).map((g) => ({ slug: g.slug, name: g.name }));
  return (
    <div className="flex flex-col gap-6">
      <PageTitle lead="Every security-relevant action on the hub: sign-ins, tokens, groups and roles, invitations, publication, reviewer links. Sign-ins and tokens belong to no group.">
        Audit log
      </PageTitle>
      {problem && <Notice tone="error">{problem.message}</Notice>}
      <AuditFilters path={path} query={page?.query ?? typedQuery(raw)} actions={page?.actions ?? []} groups={groups} fieldErrors={problem?.details?.fieldErrors} />
      {page && <AuditTable page={page} path={path} showGroup />}
    </div>
  );
}
