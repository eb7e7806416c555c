import 'server-only';
import { db } from '@/lib/db';

/** Adds one hit to a fixed window and returns the window's total (atomic across app instances). */
export async function addHit(bucket: string, windowStart: Date): Promise<number> {
  await db().raw(
    'INSERT INTO rate_limit_hits (bucket, window_start, hits) VALUES (?, ?, 1) ON DUPLICATE KEY UPDATE hits = hits + 1',
    [bucket, windowStart],
  );
  const row = await db()('rate_limit_hits').where({ bucket, window_start: windowStart }).first('hits');
  return Number(row?.hits ?? 0);
}

export async function countHits(bucket: string, windowStart: Date): Promise<number> {
  const row = await db()('rate_limit_hits').where({ bucket, window_start: windowStart }).first('hits');
  return Number(row?.hits ?? 0);
}

export async function clearHits(bucket: string): Promise<void> {
  await db()('rate_limit_hits').where({ bucket }).delete();
}

export async function pruneHits(olderThan: Date): Promise<void> {
  await db()('rate_limit_hits').where('window_start', '<', olderThan).delete();
}
