import { checkServices } from '@/lib/health/check-services';

export const dynamic = 'force-dynamic';

export async function GET() {
  const services = await checkServices();
  const ok = services.every((s) => s.ok);
  return Response.json({ status: ok ? 'ok' : 'degraded', services, time: new Date().toISOString() }, { status: ok ? 200 : 503 });
}
