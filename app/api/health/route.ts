import { checkServices } from '@/lib/health/check-services';
import { searchIndexHealth } from '@/lib/search/search-service';

export const dynamic = 'force-dynamic';

/**
 * GET /api/health — readiness: every service this instance depends on, probed now. The search index is reported as
 * it stands (building at start, then ready with its size and how far it has followed the outbox) without changing the
 * status: while it builds, searches wait for it and every other page works.
 */
export async function GET() {
  const services = await checkServices();
  const ok = services.every((s) => s.ok);
  return Response.json(
    { status: ok ? 'ok' : 'degraded', services, search: searchIndexHealth(), time: new Date().toISOString() },
    { status: ok ? 200 : 503 },
  );
}
