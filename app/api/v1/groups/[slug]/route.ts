import { readJsonBody } from '@/lib/datasets/read-json-body';
import { setStorageQuota } from '@/lib/groups/group-storage';
import { getGroupDetail } from '@/lib/groups/list-groups';
import { route } from '@/lib/http/handler';
import { requireRequestUser, userFromRequest } from '@/lib/http/request-user';

export const dynamic = 'force-dynamic';

type Ctx = { params: Promise<{ slug: string }> };

/** GET → 200 { slug, name, …, datasets: [published], storage (members and site admins, else null) }. */
export const GET = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  return Response.json(await getGroupDetail({ user: await userFromRequest(req), slug }));
});

/** PATCH { storageQuotaBytes } → 200 { storage }; site admins only. */
export const PATCH = route<Ctx>(async (req, { params }) => {
  const { slug } = await params;
  const user = await requireRequestUser(req);
  return Response.json({ storage: await setStorageQuota({ user, slug, input: await readJsonBody(req, 4 * 1024) }) });
});
