import { notFound, permanentRedirect } from 'next/navigation';
import { can } from '@/lib/access';
import { currentUser } from '@/lib/auth/session';
import { loadVersionContext } from '@/lib/datasets/version-access';
import { AppError } from '@/lib/errors';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ versionId: string }> };

/** The address a version DOI resolves to: stable by id, forwarded to the readable dataset/version page. */
export default async function VersionById({ params }: Params) {
  const { versionId } = await params;
  const ctx = await loadVersionContext(versionId, await currentUser()).catch((error: unknown) => {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    throw error;
  });
  if (!can(ctx.actor, 'view_metadata', ctx.resource)) notFound();
  permanentRedirect(`/datasets/${ctx.version.dataset_id}/versions/${ctx.version.version_number}`);
}
