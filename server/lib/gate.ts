/**
 * At most `concurrency` holders at once and at most `queueMax` waiting (first come, first served);
 * one more is refused with `busy()` at once rather than left to hang, and so is one that has waited
 * `maxWaitMs` (when given) without getting in.
 */
export function createGate(limits: { concurrency: number; queueMax: number; maxWaitMs?: number }, busy: () => Error) {
  let active = 0;
  const waiting: (() => void)[] = [];

  const release = () => {
    const next = waiting.shift();
    if (next) next();
    else active--;
  };

  return {
    /** Resolves with a release function once a place is free; throws busy() when the queue is full. */
    async acquire(): Promise<() => void> {
      if (active < limits.concurrency) {
        active++;
      } else {
        if (waiting.length >= limits.queueMax) throw busy();
        await new Promise<void>((resolve, reject) => {
          const timer =
            limits.maxWaitMs === undefined
              ? undefined
              : setTimeout(() => {
                  const k = waiting.indexOf(enter);
                  if (k >= 0) waiting.splice(k, 1);
                  reject(busy());
                }, limits.maxWaitMs);
          function enter() {
            clearTimeout(timer);
            resolve();
          }
          waiting.push(enter);
        });
      }
      let released = false;
      return () => {
        if (released) return;
        released = true;
        release();
      };
    },
    async run<R>(work: () => Promise<R>): Promise<R> {
      const done = await this.acquire();
      try {
        return await work();
      } finally {
        done();
      }
    },
    get active() {
      return active;
    },
    get waiting() {
      return waiting.length;
    },
  };
}
