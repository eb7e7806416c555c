import { route } from '@/lib/http/handler';
import { clientAddress } from '@/lib/http/client-address';
import { requireRequestUser, requireSessionUser } from '@/lib/http/request-user';
import { readJsonBody } from '@/lib/datasets/read-json-body';
import { createToken } from '@/lib/tokens/create-token';
import { listTokens } from '@/lib/tokens/list-tokens';

export const dynamic = 'force-dynamic';

/** GET → { tokens }: the caller's personal access tokens (never the secrets). Browser session only. */
export const GET = route(async (req) => {
  const user = await requireRequestUser(req);
  requireSessionUser(user);
  return Response.json({ tokens: await listTokens(user) });
});

/** POST { name, scopes, expiresInDays? } → 201 { token, id, … }: the secret is in this answer only. Browser session only. */
export const POST = route(async (req) => {
  const user = await requireRequestUser(req);
  requireSessionUser(user);
  const created = await createToken(user, await readJsonBody(req, 8 * 1024), { ip: clientAddress(req.headers) });
  return Response.json(created, { status: 201, headers: { 'cache-control': 'no-store' } });
});
