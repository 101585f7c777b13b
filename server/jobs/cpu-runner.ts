/**
 * One kind of task on the process's CPU pool, as a handle: run() queues a task, load counts this
 * handle's tasks waiting or running, close() stops them (queued ones are dropped, running ones end
 * their worker) and refuses new ones. The workers belong to the pool, not to the handle.
 */
import { cpuPool, type CpuPool } from "./cpu-pool";
import type { WorkerTaskName } from "./worker-files";

export function createCpuRunner<T, R>(task: WorkerTaskName, pool: () => CpuPool = cpuPool) {
  const stop = new AbortController();
  let load = 0;
  return {
    /** The most workers the pool may run at once (shared with every other kind of task). */
    get size() {
      return pool().options.maxThreads;
    },
    async run(payload: T, transfer: ArrayBuffer[] = []): Promise<R> {
      if (stop.signal.aborted) throw new Error(`the ${task} runner is closed`);
      load++;
      try {
        return await pool().run<T, R>(task, payload, { transfer, signal: stop.signal });
      } finally {
        load--;
      }
    },
    get load() {
      return load;
    },
    get workers() {
      return pool().workers;
    },
    async close(): Promise<void> {
      stop.abort(new Error(`the ${task} runner is closed`));
    },
  };
}
