import { route } from '@/lib/http/handler';
import { clientAddress } from '@/lib/http/client-address';
import { requireRequestUser, requireSessionUser } from '@/lib/http/request-user';
import { revokeToken } from '@/lib/tokens/revoke-token';

type Ctx = { params: Promise<{ tokenId: string }> };

/** DELETE → 200 { token }: revokes one of the caller's tokens at once. Browser session only. */
export const DELETE = route<Ctx>(async (req, { params }) => {
  const { tokenId } = await params;
  const user = await requireRequestUser(req);
  requireSessionUser(user);
  return Response.json({ token: await revokeToken(user, tokenId, { ip: clientAddress(req.headers) }) });
});
