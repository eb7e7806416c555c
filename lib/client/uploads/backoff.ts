export type RetryPolicy = {
  /** Tries per step, the first one included. */
  maxAttempts: number;
  baseDelayMs: number;
  maxDelayMs: number;
  /** Source of jitter in [0, 1); injectable for tests. */
  random: () => number;
};

export const DEFAULT_RETRY: RetryPolicy = { maxAttempts: 6, baseDelayMs: 1000, maxDelayMs: 30_000, random: Math.random };

/**
 * Wait before try number `attempt + 1` (attempt ≥ 1): exponential backoff with "equal jitter"
 * (AWS Architecture Blog, "Exponential Backoff And Jitter", 2015): t = min(cap, base·2^(n−1)); wait t/2 + U(0, t/2).
 */
export function retryDelayMs(attempt: number, policy: RetryPolicy): number {
  const ceiling = Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** (attempt - 1));
  return Math.round(ceiling / 2 + policy.random() * (ceiling / 2));
}

export type Sleep = (ms: number, signal?: AbortSignal) => Promise<void>;

/** setTimeout as a promise that rejects with the signal's reason when aborted. */
export const sleep: Sleep = (ms, signal) =>
  new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const timer = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    function onAbort() {
      clearTimeout(timer);
      reject(signal!.reason);
    }
    signal?.addEventListener('abort', onAbort, { once: true });
  });
