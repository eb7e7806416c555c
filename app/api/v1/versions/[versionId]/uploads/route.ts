import { readJson, route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { beginUpload } from '@/lib/uploads/begin-upload';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ versionId: string }> };

/** POST { name, sizeBytes, sha256, role?, mediaType? } → 201 { fileId, uploadId, partSizeBytes, partCount, parts: [{ partNumber, url }] }. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { versionId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await beginUpload({ user, versionId, input: await readJson(req) }), { status: 201 });
});
