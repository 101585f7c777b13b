/**
 * Rows that would otherwise grow for ever are deleted once they are older than their retention:
 * the security log (kept at least a year and a day, so a whole year is always visible), delivered
 * mail, failed mail (kept longer, so a sender can still see why) and the built-in mail server's catch.
 * Mail still queued is never pruned. Runs once a day on the pg-boss job queue (any process may run
 * it; running it twice deletes nothing more). docs/decisions/0082-pruning-old-rows.md
 */
import PgBoss from "pg-boss";
import { sql, type SQL } from "drizzle-orm";
import type { Logger } from "pino";
import type { Db } from "../db/client";
import { outboxMessages, outgoingMail, securityEvents } from "../db/schema/index";

export interface RetentionDays {
  securityLog: number;
  sentMail: number;
  failedMail: number;
}

export const DEFAULT_RETENTION_DAYS: RetentionDays = { securityLog: 400, sentMail: 90, failedMail: 365 };

export const PRUNE_JOB = "prune-old-rows";
/** Every day at 03:23 UTC: a quiet hour in most of the stores' time zones, off the hour's other jobs. */
export const PRUNE_CRON = "23 3 * * *";
/** Rows deleted per statement, so a first run on a large table never holds one long transaction. */
const BATCH = 5_000;

export interface PruneCounts {
  securityEvents: number;
  sentMail: number;
  failedMail: number;
  caughtMail: number;
}

const daysBefore = (now: Date, days: number) => new Date(now.getTime() - days * 86_400_000);

/** Deletes in batches the rows the subquery selects (it must select at most BATCH ids). */
async function deleteInBatches(db: Db, del: (limit: number) => SQL): Promise<number> {
  let total = 0;
  for (;;) {
    const res = await db.execute(del(BATCH));
    const n = res.rowCount ?? 0;
    total += n;
    if (n < BATCH) return total;
  }
}

export async function pruneOldRows(db: Db, keep: RetentionDays, now = new Date()): Promise<PruneCounts> {
  const logBefore = daysBefore(now, keep.securityLog);
  const sentBefore = daysBefore(now, keep.sentMail);
  const failedBefore = daysBefore(now, keep.failedMail);
  const se = securityEvents;
  const om = outgoingMail;
  const ob = outboxMessages;
  return {
    securityEvents: await deleteInBatches(
      db,
      (n) =>
        sql`delete from ${se} where ${se.id} in (select ${se.id} from ${se} where ${se.at} < ${logBefore} limit ${n})`,
    ),
    sentMail: await deleteInBatches(
      db,
      (n) =>
        sql`delete from ${om} where ${om.id} in (select ${om.id} from ${om} where ${om.state} = 'sent' and ${om.sentAt} < ${sentBefore} limit ${n})`,
    ),
    failedMail: await deleteInBatches(
      db,
      (n) =>
        sql`delete from ${om} where ${om.id} in (select ${om.id} from ${om} where ${om.state} = 'failed' and ${om.createdAt} < ${failedBefore} limit ${n})`,
    ),
    caughtMail: await deleteInBatches(
      db,
      (n) =>
        sql`delete from ${ob} where ${ob.id} in (select ${ob.id} from ${ob} where ${ob.receivedAt} < ${sentBefore} limit ${n})`,
    ),
  };
}

/**
 * Registers the daily schedule and takes prune jobs from the queue. Its own small fetch loop, as
 * the mail queue has (server/mail/mail-queue.ts): every failure is caught and logged, so a database
 * outage never becomes an unhandled rejection.
 */
export async function startPruning(
  db: Db,
  logger: Logger,
  keep: RetentionDays,
  options: { pollingIntervalS: number },
): Promise<{ stop(): Promise<void> }> {
  const pool = db.$client;
  const boss = new PgBoss({
    db: { executeSql: (text: string, values: unknown[]) => pool.query(text, values) },
    schedule: true,
    // The mail queue's instance does pg-boss's maintenance for the process.
    supervise: false,
  });
  boss.on("error", (err) => logger.warn({ err: { message: err.message } }, "pruning: job queue error"));
  await boss.start();
  if (!(await boss.getQueue(PRUNE_JOB)))
    await boss.createQueue(PRUNE_JOB, { name: PRUNE_JOB, retryLimit: 3, retryDelay: 600 });
  await boss.schedule(PRUNE_JOB, PRUNE_CRON, {}, { tz: "UTC" });

  let running = true;
  let timer: NodeJS.Timeout | null = null;
  let wake: (() => void) | null = null;
  const pause = () =>
    new Promise<void>((resolve) => {
      wake = resolve;
      timer = setTimeout(resolve, options.pollingIntervalS * 1000);
    });
  const loop = (async () => {
    while (running) {
      try {
        const [job] = await boss.fetch(PRUNE_JOB);
        if (job) {
          try {
            const counts = await pruneOldRows(db, keep);
            logger.info({ counts, keep }, "pruned old rows");
            await boss.complete(PRUNE_JOB, job.id);
          } catch (err) {
            await boss.fail(PRUNE_JOB, job.id, { reason: (err as Error).message });
          }
          continue;
        }
      } catch (err) {
        logger.warn({ err: { message: (err as Error).message } }, "pruning: job queue unavailable");
      }
      if (running) await pause();
    }
  })();

  return {
    async stop() {
      running = false;
      if (timer) clearTimeout(timer);
      wake?.();
      await loop;
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
