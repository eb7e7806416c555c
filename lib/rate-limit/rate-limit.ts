import 'server-only';
import { createHash } from 'node:crypto';
import { addHit, clearHits, countHits } from './repo';

export type RateLimit = { name: string; max: number; windowMs: number };

// Sign-in: 10 failures per address or 30 per IP in 15 minutes (OWASP Authentication Cheat Sheet: throttle, do not lock out).
export const SIGN_IN_PER_ACCOUNT: RateLimit = { name: 'sign-in-account', max: 10, windowMs: 15 * 60_000 };
export const SIGN_IN_PER_IP: RateLimit = { name: 'sign-in-ip', max: 30, windowMs: 15 * 60_000 };
export const MAIL_PER_ADDRESS: RateLimit = { name: 'mail-address', max: 5, windowMs: 15 * 60_000 };

function bucketOf(limit: RateLimit, key: string): string {
  // Keys (addresses, IPs) are hashed so the table never holds them in clear.
  return `${limit.name}:${createHash('sha256').update(key).digest('hex').slice(0, 40)}`;
}

function windowStart(limit: RateLimit, now: number): Date {
  return new Date(Math.floor(now / limit.windowMs) * limit.windowMs);
}

export async function isLimited(limit: RateLimit, key: string, now = Date.now()): Promise<boolean> {
  return (await countHits(bucketOf(limit, key), windowStart(limit, now))) >= limit.max;
}

export async function recordHit(limit: RateLimit, key: string, now = Date.now()): Promise<number> {
  return addHit(bucketOf(limit, key), windowStart(limit, now));
}

export async function resetLimit(limit: RateLimit, key: string): Promise<void> {
  await clearHits(bucketOf(limit, key));
}
