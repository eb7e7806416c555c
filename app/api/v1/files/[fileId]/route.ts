import { readJson, route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { removeFile } from '@/lib/uploads/remove-file';
import { updateFile } from '@/lib/uploads/update-file';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/** PATCH { role } → { file }. */
export const PATCH = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  const user = await requireRequestUser(req);
  return Response.json(await updateFile({ user, fileId, input: await readJson(req) }));
});

/** DELETE → 204: removes the file from a draft; its content goes when no other file uses it. */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  await removeFile({ user: await requireRequestUser(req), fileId });
  return new Response(null, { status: 204 });
});
