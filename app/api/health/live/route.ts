export const dynamic = 'force-dynamic';

/**
 * GET /api/health/live — liveness: this instance answers requests. Checks nothing else, so a load balancer's probe
 * costs no database round trip; /api/health is the readiness check with every service. Also the per-request floor
 * of the server that `npm run bench:search` compares the search API with.
 */
export function GET() {
  return Response.json({ status: 'ok' }, { headers: { 'cache-control': 'no-store' } });
}
