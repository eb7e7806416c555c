import 'server-only';
import net from 'node:net';
import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { checkBucket } from '@/lib/storage/check-bucket';

export type ServiceStatus = { name: 'database' | 'object-storage' | 'smtp' | 'doi-registration'; ok: boolean; latencyMs: number; detail?: string };

async function timed(name: ServiceStatus['name'], probe: () => Promise<void>): Promise<ServiceStatus> {
  const start = performance.now();
  try {
    await Promise.race([probe(), new Promise((_, reject) => setTimeout(() => reject(new Error('timed out after 3 s')), 3000))]);
    return { name, ok: true, latencyMs: Math.round(performance.now() - start) };
  } catch (error) {
    return { name, ok: false, latencyMs: Math.round(performance.now() - start), detail: error instanceof Error ? error.message : 'unreachable' };
  }
}

function smtpGreeting(url: string): Promise<void> {
  const { hostname, port } = new URL(url);
  return new Promise((resolve, reject) => {
    const socket = net.connect(Number(port || 25), hostname);
    socket.once('data', (chunk) => {
      socket.end('QUIT\r\n');
      if (chunk.toString().startsWith('220')) resolve();
      else reject(new Error('unexpected SMTP greeting'));
    });
    socket.once('error', reject);
  });
}

async function doiHeartbeat(): Promise<void> {
  const response = await fetch(new URL('/heartbeat', env().DOI_API_URL), { cache: 'no-store' });
  if (!response.ok) throw new Error(`HTTP ${response.status}`);
}

export async function checkServices(): Promise<ServiceStatus[]> {
  return Promise.all([
    timed('database', async () => { await db().raw('SELECT 1'); }),
    timed('object-storage', checkBucket),
    timed('smtp', () => smtpGreeting(env().SMTP_URL)),
    timed('doi-registration', doiHeartbeat),
  ]);
}
