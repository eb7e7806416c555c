import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { unitCatalogue } from '@/components/deposit/columns/unit-catalogue';
import { DraftWorkspace } from '@/components/deposit/workspace/draft-workspace';
import { Notice } from '@/components/ui/notice';
import { currentUser } from '@/lib/auth/session';
import { getVersionView } from '@/lib/datasets/get-version-view';
import { AppError } from '@/lib/errors';
import { requireSignedIn } from '../../_auth/require-signed-in';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ versionId: string }> };

function isRefusal(error: unknown): boolean {
  if (error instanceof AppError) return ['not_found', 'forbidden', 'not_signed_in'].includes(error.code);
  const status = (error as { status?: unknown } | null)?.status;
  return status === 401 || status === 403 || status === 404; // lib/access refusals
}

// One read per request, shared by the page and its metadata.
const loadView = cache(async (versionId: string, user: NonNullable<Awaited<ReturnType<typeof currentUser>>>) => {
  try {
    return await getVersionView({ user, versionId });
  } catch (error) {
    if (isRefusal(error)) return null;
    throw error;
  }
});

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  const user = await currentUser();
  const view = user ? await loadView((await params).versionId, user) : null;
  return { title: view ? `Draft: ${view.version.title}` : 'Draft' };
}

function unitsOf(metadata: unknown): string[] {
  const columns = (metadata as { columns?: unknown } | null)?.columns;
  return Array.isArray(columns) ? columns.flatMap((c) => (typeof c?.unit === 'string' ? [c.unit] : [])) : [];
}

export default async function DraftPage({ params }: Params) {
  const { versionId } = await params;
  const user = await requireSignedIn(`/deposit/${versionId}`);
  const view = await loadView(versionId, user);
  if (!view) notFound();
  const { version } = view;
  const canEdit = view.allowedActions.includes('edit');
  return (
    <div className="flex flex-col gap-4">
      {version.state !== 'draft' && (
        <Notice tone="info" title="This version is no longer a draft">
          It is {version.state.replace('_', ' ')}, so it cannot be changed here. Changes go into a new version.
        </Notice>
      )}
      <DraftWorkspace
        key={version.id}
        versionId={version.id}
        record={version.metadata ?? {}}
        updatedAt={version.updatedAt}
        files={view.files}
        canEdit={canEdit}
        catalogue={unitCatalogue(unitsOf(version.metadata))}
        heading={{
          groupSlug: version.group.slug, groupName: version.group.name, versionNumber: version.versionNumber, state: version.state,
          doi: version.doi, doiState: version.doiState, conceptDoi: version.conceptDoi,
        }}
      />
    </div>
  );
}
