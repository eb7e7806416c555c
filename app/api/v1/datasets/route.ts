import { createDataset, parseCreateDatasetBody } from '@/lib/datasets/create-dataset';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

/** POST { group, title } → 201 { datasetId, versionId, versionNumber, doi, conceptDoi, doiState }. */
export const POST = route(async (req) => {
  const user = await requireRequestUser(req);
  const body = parseCreateDatasetBody(await readJsonBody(req, 64 * 1024));
  return Response.json(await createDataset({ user, groupSlug: body.group, title: body.title }), { status: 201 });
});
