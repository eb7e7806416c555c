import { describe, expect, it } from 'vitest';
import { retryDelayMs, sleep, type RetryPolicy } from '@/lib/client/uploads/backoff';
import { createLimiter } from '@/lib/client/uploads/limiter';

const policy = (random: number): RetryPolicy => ({ maxAttempts: 6, baseDelayMs: 1000, maxDelayMs: 30_000, random: () => random });

describe('exponential backoff with equal jitter', () => {
  it('doubles the ceiling per attempt and waits between half and all of it (AWS "Exponential Backoff And Jitter")', () => {
    // ceilings 1 s, 2 s, 4 s, 8 s, 16 s, then capped at 30 s
    expect([1, 2, 3, 4, 5, 6, 7].map((n) => retryDelayMs(n, policy(0)))).toEqual([500, 1000, 2000, 4000, 8000, 15_000, 15_000]);
    expect([1, 2, 3, 4, 5, 6, 7].map((n) => retryDelayMs(n, policy(0.5)))).toEqual([750, 1500, 3000, 6000, 12_000, 22_500, 22_500]);
    expect(retryDelayMs(3, policy(0.999))).toBe(3998);
  });

  it('sleep rejects with the abort reason as soon as its signal aborts', async () => {
    const c = new AbortController();
    const started = Date.now();
    const p = sleep(10_000, c.signal);
    setTimeout(() => c.abort('paused'), 5);
    await expect(p).rejects.toBe('paused');
    expect(Date.now() - started).toBeLessThan(1000);
  });
});

describe('limiter', () => {
  it('lets at most N holders in and hands slots over in order', async () => {
    const limit = createLimiter(3);
    const releases = await Promise.all([limit.acquire(), limit.acquire(), limit.acquire()]);
    expect(limit.active).toBe(3);
    const order: number[] = [];
    const fourth = limit.acquire().then((r) => { order.push(4); return r; });
    const fifth = limit.acquire().then((r) => { order.push(5); return r; });
    expect(limit.waiting).toBe(2);
    releases[0]();
    releases[0](); // a second release of the same slot is ignored
    await fourth;
    expect(order).toEqual([4]);
    expect(limit.active).toBe(3);
    releases[1]();
    await fifth;
    expect(order).toEqual([4, 5]);
  });

  it('drops a waiting acquire when its signal aborts, without losing a slot', async () => {
    const limit = createLimiter(1);
    const first = await limit.acquire();
    const c = new AbortController();
    const waiting = limit.acquire(c.signal);
    c.abort('cancelled');
    await expect(waiting).rejects.toBe('cancelled');
    expect(limit.waiting).toBe(0);
    first();
    expect(limit.active).toBe(0);
    const again = await limit.acquire();
    expect(limit.active).toBe(1);
    again();
  });
});
