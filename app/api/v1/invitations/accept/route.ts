import schema from '@/schemas/api/answer-invitation.schema.json';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { acceptInvitation } from '@/lib/groups/accept-invitation';
import { asObject, parseWith } from '@/lib/groups/parse-input';
import { route } from '@/lib/http/handler';
import { requireRequestUser } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

/** POST { token } → 200 { groupSlug, groupName, role, alreadyMember }; as the account with the invited address. */
export const POST = route(async (req) => {
  const user = await requireRequestUser(req);
  const { token } = parseWith<{ token: string }>(schema, asObject(await readJsonBody(req, 1024), 'Send a JSON object with "token".'));
  return Response.json(await acceptInvitation({ user, token }));
});
