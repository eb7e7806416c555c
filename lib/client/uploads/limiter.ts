/** A counting semaphore: at most `max` holders at once; a waiting acquire leaves the queue when its signal aborts. */
export type Limiter = {
  acquire(signal?: AbortSignal): Promise<() => void>;
  readonly active: number;
  readonly waiting: number;
};

export function createLimiter(max: number): Limiter {
  let active = 0;
  const queue: { grant: () => void }[] = [];

  function releaser(): () => void {
    let released = false;
    return () => {
      if (released) return;
      released = true;
      active -= 1;
      const next = queue.shift();
      if (next) next.grant();
    };
  }

  return {
    get active() {
      return active;
    },
    get waiting() {
      return queue.length;
    },
    acquire(signal) {
      if (signal?.aborted) return Promise.reject(signal.reason);
      if (active < max) {
        active += 1;
        return Promise.resolve(releaser());
      }
      return new Promise((resolve, reject) => {
        const entry = {
          grant: () => {
            signal?.removeEventListener('abort', onAbort);
            active += 1;
            resolve(releaser());
          },
        };
        function onAbort() {
          const i = queue.indexOf(entry);
          if (i >= 0) queue.splice(i, 1);
          reject(signal!.reason);
        }
        signal?.addEventListener('abort', onAbort, { once: true });
        queue.push(entry);
      });
    },
  };
}
