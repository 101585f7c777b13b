/**
 * Background jobs on pg-boss (decisions 0034, 0085): analyses and the daily digest. Every app
 * process runs the worker, and pg-boss hands each job to one of them (SKIP LOCKED). A job has
 * retries with backoff, a time limit (the queue's expiry: a job whose worker crashed is handed out
 * again once it passes), and after its last try it stays `failed` in pg-boss's table, copied to the
 * dead-letter queue, where the owner's "Failed jobs" screen reads it (server/api/jobs). Mail keeps
 * its own queue (server/mail/mail-queue.ts) on the same engine.
 */
import PgBoss from "pg-boss";
import type { Logger } from "pino";
import type { Db } from "../db/client";

export const JOBS_DEAD_LETTER = "jobs-dead";

/** One kind of job: its queue settings and what running it does. */
export interface JobDefinition {
  /** Tries after the first. */
  retryLimit: number;
  /** Base delay before a retry, doubled per retry (pg-boss retryBackoff). */
  retryDelayS: number;
  /** The most one try may take: past it the try fails here, and pg-boss expires it for any crashed worker. */
  timeLimitS: number;
  /** "short": at most one waiting job per singleton key (a repeated ask joins the waiting one). */
  policy?: "standard" | "short";
  /** A cron schedule (UTC) on which pg-boss queues the job once across all processes. */
  cron?: string;
  /** Resolves when done (with an output pg-boss keeps on the job, e.g. a refusal that is not worth a retry). */
  run(data: Record<string, unknown>): Promise<{ reason: string } | void>;
  /** Called once when the last try has failed, before the job is dead-lettered: show the failure where the user looks. */
  gaveUp?(data: Record<string, unknown>, reason: string): Promise<void>;
}

export interface JobQueueOptions {
  pollingIntervalS: number;
  /** How often pg-boss looks for expired jobs (a crashed worker's) and archives old ones. */
  maintenanceIntervalS: number;
  /** Expiry is the time limit plus this: our own timer fails a live try first; expiry is for a worker that died. */
  expiryMarginS: number;
}

/** A reason short and safe enough for the owner's screen. */
function reasonOf(err: unknown): string {
  return (err instanceof Error ? err.message : String(err)).slice(0, 300);
}

class TimeLimitError extends Error {}

export function createJobQueue(db: Db, logger: Logger, options: Partial<JobQueueOptions> = {}) {
  const opts: JobQueueOptions = { pollingIntervalS: 2, maintenanceIntervalS: 60, expiryMarginS: 30, ...options };
  let boss: PgBoss | null = null;
  const defs = new Map<string, JobDefinition>();
  const loops: Promise<void>[] = [];
  const wakers = new Map<string, () => void>();
  let active = 0;

  const pause = (name: string, ms: number) =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, ms);
      function done() {
        clearTimeout(timer);
        wakers.delete(name);
        resolve();
      }
      wakers.set(name, done);
    });

  async function runOne(def: JobDefinition, data: Record<string, unknown>): Promise<{ reason: string } | void> {
    let timer: NodeJS.Timeout | undefined;
    const limit = new Promise<never>((_, reject) => {
      timer = setTimeout(
        () => reject(new TimeLimitError(`took longer than its time limit of ${def.timeLimitS} s`)),
        def.timeLimitS * 1000,
      );
    });
    try {
      return await Promise.race([def.run(data), limit]);
    } finally {
      clearTimeout(timer);
    }
  }

  /** One loop per kind, so a long analysis never holds up a digest; each call awaited, each failure caught. */
  async function loop(b: PgBoss, name: string, def: JobDefinition): Promise<void> {
    while (boss === b) {
      try {
        const [job] = await b.fetch<Record<string, unknown>>(name, { batchSize: 1, includeMetadata: true });
        if (!job) {
          await pause(name, opts.pollingIntervalS * 1000);
          continue;
        }
        active++;
        try {
          const output = await runOne(def, job.data);
          if (output) await b.complete(name, job.id, output);
          else await b.complete(name, job.id);
        } catch (err) {
          const last = job.retryCount >= job.retryLimit;
          logger.warn(
            { job: name, jobId: job.id, last, err: { message: reasonOf(err) } },
            last ? "job failed for good" : "job failed; pg-boss retries it",
          );
          if (last && def.gaveUp) await def.gaveUp(job.data, reasonOf(err));
          await b.fail(name, job.id, { reason: reasonOf(err) });
        } finally {
          active--;
        }
      } catch (err) {
        // The database is away: the job (if one was taken) expires and is handed out again.
        logger.warn({ job: name, err: { message: reasonOf(err) } }, "job worker: queue unavailable");
        await pause(name, opts.pollingIntervalS * 1000);
      }
    }
  }

  return {
    /** Whether jobs go through the queue; without it (API tests, tools) callers run the work inline. */
    get running(): boolean {
      return boss !== null;
    },
    /** Whether this process also takes jobs (RUN_JOBS; a process may only queue them). */
    get working(): boolean {
      return boss !== null && loops.length > 0;
    },
    /** Jobs running in this process now (graceful shutdown waits for them). */
    get active(): number {
      return active;
    },
    /** Queues a job; resolves with its id, or null when an equal one (same singleton key) is already waiting. */
    async send(name: string, data: Record<string, unknown>, singletonKey?: string): Promise<string | null> {
      if (!boss) throw new Error("the job queue is not running");
      const id = await boss.send(name, data, singletonKey ? { singletonKey } : {});
      wakers.get(name)?.(); // this process looks at once instead of at its next poll
      return id;
    },
    /** Waiting (created or retry) and running jobs of a kind, across every process. */
    async backlog(name: string): Promise<number> {
      if (!boss) return 0;
      return boss.getQueueSize(name, { before: "completed" });
    },
    /** A job's state and, once it has failed, the reason of its last try. */
    async state(name: string, id: string): Promise<{ state: string; reason: string | null } | null> {
      if (!boss) return null;
      const job = await boss.getJobById<unknown>(name, id);
      if (!job) return null;
      const output = job.output as { reason?: string } | null;
      return { state: job.state, reason: output?.reason ?? null };
    },
    /** Creates (or updates) the queues and, unless `work` is false, starts one worker loop per kind on the app's own pool. */
    async start(definitions: Record<string, JobDefinition>, { work = true } = {}): Promise<void> {
      const pool = db.$client;
      const b = new PgBoss({
        db: { executeSql: (text: string, values: unknown[]) => pool.query(text, values) },
        schedule: Object.values(definitions).some((d) => d.cron),
        maintenanceIntervalSeconds: opts.maintenanceIntervalS,
      });
      b.on("error", (err) => logger.warn({ err: { message: err.message } }, "job queue error"));
      await b.start();
      await b.createQueue(JOBS_DEAD_LETTER);
      for (const [name, def] of Object.entries(definitions)) {
        const queue = {
          name,
          policy: def.policy ?? "standard",
          retryLimit: def.retryLimit,
          retryDelay: def.retryDelayS,
          retryBackoff: true,
          expireInSeconds: def.timeLimitS + opts.expiryMarginS,
          deadLetter: JOBS_DEAD_LETTER,
        };
        if (await b.getQueue(name)) await b.updateQueue(name, queue);
        else await b.createQueue(name, queue);
        if (def.cron) await b.schedule(name, def.cron, {}, { tz: "UTC" });
        defs.set(name, def);
      }
      boss = b;
      if (work) for (const [name, def] of defs) loops.push(loop(b, name, def));
    },
    /** Stops taking jobs; the ones running finish, bounded by timeoutMs. */
    async stop(timeoutMs = 10_000): Promise<void> {
      const b = boss;
      boss = null;
      for (const wake of [...wakers.values()]) wake();
      await Promise.race([Promise.all(loops.splice(0)), new Promise((r) => setTimeout(r, timeoutMs).unref())]);
      if (b) await b.stop({ graceful: true, wait: true, timeout: timeoutMs });
    },
  };
}

export type JobQueue = ReturnType<typeof createJobQueue>;
