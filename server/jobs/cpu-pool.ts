/**
 * The one pool of worker threads for CPU-heavy work in this process (piscina): the locator, report
 * PDFs, plan and photo decoding, password hashing. The event loop keeps answering requests while
 * tasks run, and password checks and long tasks each keep to a lane of workers (SHORT_TASKS). Bounded three ways: at most `maxThreads` workers (the whole process's CPU budget), at
 * most `maxQueue` tasks waiting (more is CpuBusyError: 503 with Retry-After), and a time limit per
 * task (the worker running an overdue task is stopped and replaced). Each worker's JavaScript heap
 * is capped by `maxHeapMb` (piscina resourceLimits): a task that needs more ends its worker, not the
 * process. Idle workers are unref'd, so they never keep a process or a test run alive.
 * docs/decisions/0080-one-cpu-worker-pool.md
 */
import os from "node:os";
import { Piscina } from "piscina";
import { HttpError } from "../lib/http-error";
import { createGate } from "../lib/gate";
import { POOL_ENTRY, workerModule, type WorkerTaskName } from "./worker-files";
import type { TaskReply } from "./worker-task";

/**
 * Two lanes of at most maxThreads - 1 workers each (at least one): the long kinds (the locator,
 * PDFs, decoding) and short tasks (a password check is a quarter of a second). A sign-in never waits
 * behind a ten-second analysis, and a burst of sign-ins never takes every core from the event loop
 * (bench:sign-in). With one worker the lanes share it.
 */
const SHORT_TASKS: ReadonlySet<WorkerTaskName> = new Set(["password"]);

export interface CpuPoolOptions {
  /** Worker threads at most (default: one per core; the long kinds leave one of them to short tasks). */
  maxThreads: number;
  /** Tasks waiting for a worker at most; beyond it run() throws CpuBusyError. */
  maxQueue: number;
  /** A task not finished this long after it was handed to the pool (queue wait included) is stopped; a running one's worker is replaced. */
  taskTimeoutMs: number;
  /** Each worker's JavaScript heap (old generation) at most, in MB. */
  maxHeapMb: number;
  /** How much lower the workers' scheduling priority is than the event loop's (Unix nice, 0-19; needs @napi-rs/nice). */
  niceIncrement: number;
}

export function defaultCpuPoolOptions(): CpuPoolOptions {
  return {
    maxThreads: os.availableParallelism(),
    maxQueue: 100,
    taskTimeoutMs: 120_000,
    maxHeapMb: 512,
    // 0: on a machine shared with other work, a lowered priority starved the workers (a 40-megapixel
    // decode took minutes) for no measurable gain in bench:sign-in (docs/decisions/0080).
    niceIncrement: 0,
  };
}

/** A task failed on its input (the worker answered with a reason, e.g. the locator's problems). */
export class JobError extends Error {
  constructor(
    message: string,
    readonly problems?: string[],
  ) {
    super(message);
    this.name = "JobError";
  }
}

/** The queue is full: an answer the caller can give as it is (503, try again shortly). */
export class CpuBusyError extends HttpError {
  constructor() {
    super(503, "busy", "The server is busy with other work; please try again in a few seconds.", undefined, {
      retryAfterSeconds: 5,
    });
    this.name = "CpuBusyError";
  }
}

/** A task ran past its time limit and was stopped. */
export class CpuTimeoutError extends Error {
  constructor(
    readonly task: WorkerTaskName,
    readonly timeoutMs: number,
  ) {
    super(`the ${task} task took longer than ${timeoutMs} ms and was stopped`);
    this.name = "CpuTimeoutError";
  }
}

export interface RunOptions {
  /** Buffers moved (not copied) to the worker; they are unusable here afterwards. */
  transfer?: ArrayBuffer[];
  /** Overrides the pool's time limit for this task. */
  timeoutMs?: number;
  /** Stops the task early (e.g. a runner being closed). */
  signal?: AbortSignal;
}

export function createCpuPool(options: Partial<CpuPoolOptions> = {}) {
  const o = { ...defaultCpuPoolOptions(), ...options };
  if (!(Number.isInteger(o.maxThreads) && o.maxThreads >= 1))
    throw new RangeError(`maxThreads: must be a whole number of workers, at least 1, got ${o.maxThreads}`);
  const piscina = new Piscina({
    filename: POOL_ENTRY,
    minThreads: 0,
    maxThreads: o.maxThreads,
    // The queue limit is counted here, in run(): piscina's maxQueue skips tasks that carry an
    // AbortSignal, and every task here carries one (its time limit).
    // Starting a worker (tsx, the task's imports) costs a few hundred ms: keep one a while.
    idleTimeout: 60_000,
    // A worker waits for tasks on its event loop, not in Atomics.wait, so async task code is never parked.
    atomics: "disabled",
    resourceLimits: { maxOldGenerationSizeMb: o.maxHeapMb },
    niceIncrement: o.niceIncrement,
  });
  let inFlight = 0;
  // Each lane's tasks wait here for one of its workers; the queue limit is counted in run().
  const lane = () =>
    createGate(
      { concurrency: Math.max(1, o.maxThreads - 1), queueMax: Number.MAX_SAFE_INTEGER },
      () => new CpuBusyError(),
    );
  const shortLane = lane();
  const longLane = lane();

  return {
    options: o,
    async run<T, R>(task: WorkerTaskName, payload: T, run: RunOptions = {}): Promise<R> {
      if (inFlight >= o.maxThreads + o.maxQueue) throw new CpuBusyError();
      const timeoutMs = run.timeoutMs ?? o.taskTimeoutMs;
      const timeout = AbortSignal.timeout(timeoutMs);
      const signal = run.signal ? AbortSignal.any([timeout, run.signal]) : timeout;
      inFlight++;
      let reply: TaskReply<R>;
      try {
        const go = (): Promise<TaskReply<R>> =>
          piscina.run({ module: workerModule(task), payload }, { transferList: run.transfer, signal });
        reply = await (SHORT_TASKS.has(task) ? shortLane : longLane).run(go);
      } catch (err) {
        if (timeout.aborted) throw new CpuTimeoutError(task, timeoutMs);
        throw err;
      } finally {
        inFlight--;
      }
      if (!reply.ok) throw new JobError(reply.message, reply.problems);
      return reply.result;
    },
    /** Tasks waiting for a worker plus those running. */
    get load() {
      return inFlight;
    },
    get workers() {
      return piscina.threads.length;
    },
    /** Stops every worker; tasks still waiting or running fail. */
    close(): Promise<void> {
      return piscina.destroy();
    },
  };
}

export type CpuPool = ReturnType<typeof createCpuPool>;

let shared: CpuPool | null = null;
let sharedOptions: Partial<CpuPoolOptions> = {};

/** Sets the process pool's options (server/env.ts); takes effect for the pool made next. */
export function configureCpuPool(options: Partial<CpuPoolOptions>): void {
  sharedOptions = options;
}

/** The process's one pool, made on first use. */
export function cpuPool(): CpuPool {
  return (shared ??= createCpuPool(sharedOptions));
}

/** Work waiting or running in the process pool (0 when it was never made). */
export function cpuPoolLoad(): number {
  return shared?.load ?? 0;
}

/** Stops the process pool's workers (shutdown); the next cpuPool() makes a new one. */
export async function closeCpuPool(): Promise<void> {
  const p = shared;
  shared = null;
  await p?.close();
}
