import schema from '@/schemas/api/send-reviewer-link.schema.json';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';
import { readLinkBody } from '@/lib/review/read-body';
import { sendReviewerLink, type SendLinkInput } from '@/lib/review/send-reviewer-link';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ linkId: string }> };

/** POST { email, token, message? } → 200 { linkId, delivery: 'sent' } or 202 when the mail waits in the outbox. */
export const POST = route<Ctx>(async (req, { params }) => {
  const { linkId } = await params;
  const user = await requireRequestUser(req);
  const input = await readLinkBody<SendLinkInput>(req, schema);
  const result = await sendReviewerLink({ user, linkId, input });
  return Response.json(result, { status: result.delivery === 'sent' ? 200 : 202 });
});
