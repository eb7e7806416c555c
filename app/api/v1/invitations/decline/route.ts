import schema from '@/schemas/api/answer-invitation.schema.json';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { declineInvitation } from '@/lib/groups/decline-invitation';
import { asObject, parseWith } from '@/lib/groups/parse-input';
import { route } from '@/lib/http/handler';
import { userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** POST { token } → 200 { groupSlug, groupName }; the token alone is enough (no account needed). */
export const POST = route(async (req) => {
  const user = await userFromRequest(req);
  const { token } = parseWith<{ token: string }>(schema, asObject(await readJsonBody(req, 1024), 'Send a JSON object with "token".'));
  return Response.json(await declineInvitation({ user, token }));
});
