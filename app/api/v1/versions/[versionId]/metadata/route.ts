import { MAX_METADATA_BYTES, needsFixingError, saveMetadata } from '@/lib/datasets/save-metadata';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

type Ctx = { params: Promise<{ versionId: string }> };

/** PUT <record> → 200 { saved, complete, errors }, or 422 when the saved draft has wrong values (details.saved = true). */
export const PUT = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  const result = await saveMetadata({ user, versionId, record: await readJsonBody(req, MAX_METADATA_BYTES) });
  const refusal = needsFixingError(result);
  if (refusal) throw refusal;
  return Response.json({ saved: result.saved, complete: result.complete, errors: result.errors });
});
