// Retry schedule for outbox jobs: exponential, so a service that is down for hours is asked a few times an hour.
export const FIRST_RETRY_MS = 10_000;
export const MAX_RETRY_MS = 10 * 60_000;

/** Delay before the next try after `attempts` failed tries (1 → 10 s, 2 → 20 s, … capped at 10 min). */
export function retryDelayMs(attempts: number): number {
  const n = Math.max(1, Math.floor(attempts));
  return Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.min(n - 1, 30));
}
