import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { cancelUpload } from '@/lib/uploads/cancel-upload';
import { getUploadStatus } from '@/lib/uploads/get-upload-status';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ fileId: string }> };

/** GET → where the upload stands: completedParts, and fresh URLs for the missing parts (resume). */
export const GET = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  return Response.json(await getUploadStatus({ user: await requireRequestUser(req), fileId }));
});

/** DELETE → 204: cancels an upload in progress; its staged parts are deleted. */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { fileId } = await params;
  await cancelUpload({ user: await requireRequestUser(req), fileId });
  return new Response(null, { status: 204 });
});
