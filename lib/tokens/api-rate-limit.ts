import 'server-only';
import { AppError } from '@/lib/errors';
import { recordHit, type RateLimit } from '@/lib/rate-limit/rate-limit';

// Fixed one-minute windows: a script on a lab PC gets 10 requests/s on average; anonymous callers far less.
export const API_PER_TOKEN: RateLimit = { name: 'api-token', max: 600, windowMs: 60_000 };
export const API_PER_IP_ANONYMOUS: RateLimit = { name: 'api-ip', max: 120, windowMs: 60_000 };

/** Seconds until the current fixed window closes (at least 1), for the Retry-After header. */
export function retryAfterSeconds(limit: RateLimit, now: number): number {
  return Math.max(1, Math.ceil((limit.windowMs - (now % limit.windowMs)) / 1000));
}

/** Counts one request against `limit` for `key`; past the limit throws 429 with details.retryAfterSeconds. */
export async function enforceRateLimit(limit: RateLimit, key: string, now = Date.now()): Promise<void> {
  const hits = await recordHit(limit, key, now);
  if (hits <= limit.max) return;
  const retry = retryAfterSeconds(limit, now);
  throw new AppError('rate_limited', `Too many requests: the limit is ${limit.max} a minute. Try again in ${retry} s.`, {
    retryAfterSeconds: retry,
    limit: limit.max,
  });
}
