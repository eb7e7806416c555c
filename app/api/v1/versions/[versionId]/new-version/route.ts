import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { createNewVersion } from '@/lib/publishing/create-new-version';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST (no body; :versionId is the dataset's latest published version) → 201 { datasetId, versionId, versionNumber, doi, doiState, fileCount }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await createNewVersion({ user, versionId }), { status: 201 });
});
