// Our retry schedule: exponential backoff capped at 10 minutes; first retry after 10 s (our choice).
import { describe, expect, it } from 'vitest';
import { MAX_RETRY_MS, retryDelayMs } from '@/lib/outbox/backoff';

describe('outbox retry delay', () => {
  it('doubles from 10 s per failed attempt', () => {
    expect([1, 2, 3, 4, 5, 6].map(retryDelayMs)).toEqual([10_000, 20_000, 40_000, 80_000, 160_000, 320_000]);
  });

  it('stays at 10 minutes from the 7th attempt on, even after very many', () => {
    expect(MAX_RETRY_MS).toBe(600_000);
    expect(retryDelayMs(7)).toBe(600_000);
    expect(retryDelayMs(1000)).toBe(600_000);
  });

  it('treats 0 or negative attempts as the first', () => {
    expect(retryDelayMs(0)).toBe(10_000);
    expect(retryDelayMs(-3)).toBe(10_000);
  });
});
