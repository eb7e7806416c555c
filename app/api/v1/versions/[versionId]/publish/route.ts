import schema from '@/schemas/api/publish-version.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { publishVersion } from '@/lib/publishing/publish-version';
import { readTransitionBody } from '@/lib/publishing/request-body';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { embargoUntil?: date | null } → 200 { versionId, state: 'published', doi, doiState, embargoUntil, publishedAt }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const body = await readTransitionBody<{ embargoUntil?: string | null }>(req, schema);
  return Response.json(await publishVersion({ user, versionId, embargoUntil: body.embargoUntil }));
});
