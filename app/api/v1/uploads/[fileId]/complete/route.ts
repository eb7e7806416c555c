import { readJson, route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { completeUpload } from '@/lib/uploads/complete-upload';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/** POST { parts?: [{ partNumber, etag }] } (body optional) → 200 { file }; 422 when size or SHA-256 differ, 503 when storage is down. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  const user = await requireRequestUser(req);
  const input = (await req.clone().text()).trim() === '' ? {} : await readJson(req);
  return Response.json(await completeUpload({ user, fileId, input }));
});
