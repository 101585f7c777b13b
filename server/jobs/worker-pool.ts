/**
 * A small pool of worker threads for CPU-heavy jobs (the locator, report rendering), so the event
 * loop keeps answering requests while they run. At most `size` workers (default: one per core, less
 * one for the event loop, at least one); each runs one job at a time and the rest wait in a queue.
 * A worker that crashes fails its job and is replaced on the next one. Idle workers are unref'd so
 * they never keep a process or a test run alive.
 */
import os from "node:os";
import { Worker } from "node:worker_threads";
import { COMPILED } from "../paths";

// From source a worker needs tsx registered first (worker-entry.mjs); a compiled module starts as it is.
const ENTRY = new URL("./worker-entry.mjs", import.meta.url);

/** What a job module posts back (see serveJobs). */
export type JobReply<R> =
  | { id: number; ok: true; result: R }
  | { id: number; ok: false; message: string; problems?: string[] };

export class JobError extends Error {
  constructor(
    message: string,
    readonly problems?: string[],
  ) {
    super(message);
    this.name = "JobError";
  }
}

interface Slot {
  worker: Worker;
  busy: boolean;
}

interface Job<T, R> {
  id: number;
  payload: T;
  transfer: ArrayBuffer[];
  resolve(r: R): void;
  reject(e: Error): void;
}

export interface WorkerPoolOptions {
  /** file URL of the job module (a file that calls serveJobs; see serverModule in server/paths.ts). */
  module: URL;
  size?: number;
}

export function defaultPoolSize(): number {
  return Math.max(1, os.availableParallelism() - 1);
}

export function createWorkerPool<T, R>({ module, size = defaultPoolSize() }: WorkerPoolOptions) {
  if (!(Number.isInteger(size) && size >= 1))
    throw new RangeError(`size: must be a whole number of workers, at least 1, got ${size}`);
  const slots: Slot[] = [];
  const queue: Job<T, R>[] = [];
  const running = new Map<Worker, Job<T, R>>();
  let nextId = 1;
  let closed = false;

  const finish = (slot: Slot) => {
    running.delete(slot.worker);
    slot.busy = false;
    slot.worker.unref();
    pump();
  };

  const spawn = (): Slot => {
    const worker = COMPILED ? new Worker(module) : new Worker(ENTRY, { workerData: { module: module.href } });
    const slot: Slot = { worker, busy: false };
    worker.unref();
    worker.on("message", (reply: JobReply<R>) => {
      const job = running.get(worker);
      if (!job || job.id !== reply.id) return;
      if (reply.ok) job.resolve(reply.result);
      else job.reject(new JobError(reply.message, reply.problems));
      finish(slot);
    });
    const fail = (err: Error) => {
      const job = running.get(worker);
      running.delete(worker);
      const k = slots.indexOf(slot);
      if (k >= 0) slots.splice(k, 1);
      job?.reject(err);
      pump();
    };
    worker.on("error", fail);
    worker.on("exit", (code) => fail(new Error(`a worker stopped (exit code ${code})`)));
    slots.push(slot);
    return slot;
  };

  function pump() {
    while (queue.length > 0 && !closed) {
      let slot = slots.find((s) => !s.busy);
      if (!slot && slots.length < size) slot = spawn();
      if (!slot) return;
      const job = queue.shift()!;
      slot.busy = true;
      slot.worker.ref(); // a running job keeps the process alive until it answers
      running.set(slot.worker, job);
      slot.worker.postMessage({ id: job.id, payload: job.payload }, job.transfer);
    }
  }

  return {
    size,
    run(payload: T, transfer: ArrayBuffer[] = []): Promise<R> {
      if (closed) return Promise.reject(new Error("the worker pool is closed"));
      return new Promise<R>((resolve, reject) => {
        queue.push({ id: nextId++, payload, transfer, resolve, reject });
        pump();
      });
    },
    /** Jobs waiting for a free worker plus those running. */
    get load() {
      return queue.length + running.size;
    },
    get workers() {
      return slots.length;
    },
    async close() {
      closed = true;
      for (const job of queue.splice(0)) job.reject(new Error("the worker pool is closed"));
      await Promise.all(slots.splice(0).map((s) => s.worker.terminate()));
    },
  };
}
