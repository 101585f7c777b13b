/**
 * The durable outgoing mail queue. A message is a row in `outgoing_mail`, written (in the
 * caller's transaction when it has one) before the request answers; a pg-boss job then delivers
 * it over SMTP, retried with exponential backoff, so a mail server outage delays mail instead of
 * failing the request. Each row keeps its state (preparing, queued, sent, failed), attempts and last error
 * for the screen it was sent from. A row is claimed with a short lease before sending, so two
 * jobs for one message (a re-handed row) never both send it.
 */
import PgBoss from "pg-boss";
import { and, asc, eq, isNull, lt, or, sql } from "drizzle-orm";
import type { Logger } from "pino";
import type { Db } from "../db/client";
import { outgoingMail, type MAIL_KINDS } from "../db/schema/index";
import type { MailTransport, OutgoingMail } from "./mailer";

export type MailKind = (typeof MAIL_KINDS)[number];
export type Queueable = OutgoingMail & {
  kind: MailKind;
  subjectId?: string | null;
  /** Written "preparing": its attachment is still being made (a report's PDF job); not sent until it is "queued". */
  preparing?: boolean;
};
type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export const MAIL_JOB = "mail-send";
export const MAIL_DEAD_LETTER = "mail-dead";
/** How long one delivery may hold a message before another job may try it. */
const LEASE_S = 120;

export interface MailQueueOptions {
  /** Tries after the first (pg-boss retryLimit). */
  retryLimit: number;
  /** Base delay in seconds; pg-boss doubles it per retry, with jitter. */
  retryDelayS: number;
  pollingIntervalS: number;
}

export const MAIL_QUEUE_DEFAULTS: MailQueueOptions = { retryLimit: 8, retryDelayS: 30, pollingIntervalS: 2 };

/** A short, safe reason for the sender: the SMTP reply or the network error, without credentials. */
export function describeMailError(err: unknown): string {
  const e = err as { code?: string; responseCode?: number; response?: string; message?: string };
  if (e?.responseCode && e.response) return `The mail server refused it: ${e.response}`.slice(0, 300);
  if (e?.code === "ECONNREFUSED" || e?.code === "ESOCKET") return "The mail server could not be reached.";
  if (e?.code === "ETIMEDOUT" || e?.code === "ECONNECTION") return "The mail server did not answer in time.";
  return `Sending failed: ${e?.message ?? String(err)}`.slice(0, 300);
}

export function createMailQueue(
  db: Db,
  transport: MailTransport,
  logger: Logger,
  options: Partial<MailQueueOptions> = {},
) {
  const opts = { ...MAIL_QUEUE_DEFAULTS, ...options };
  let boss: PgBoss | null = null;
  let sweepTimer: NodeJS.Timeout | null = null;
  let loop: Promise<void> | null = null;
  let wake: (() => void) | null = null;
  const pause = (ms: number) =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, ms);
      function done() {
        clearTimeout(timer);
        wake = null;
        resolve();
      }
      wake = done;
    });

  /** Takes one job at a time while the worker runs; every call is awaited and every failure caught. */
  async function runLoop(b: PgBoss): Promise<void> {
    // A job fetched just before the database went away is still this worker's: it is delivered again
    // once the database answers, instead of waiting out pg-boss's expiry.
    type MailJob = { id: string; data: { mailId: string }; retryCount: number; retryLimit: number };
    let held: MailJob | null = null;
    let heldSince = 0;
    while (boss === b) {
      // Held no longer than a lease: after that pg-boss's own expiry and retry take over.
      if (held && Date.now() - heldSince > LEASE_S * 1000) held = null;
      try {
        const job: MailJob | undefined =
          held ?? (await b.fetch<{ mailId: string }>(MAIL_JOB, { includeMetadata: true, batchSize: 1 }))[0];
        if (!job) {
          await pause(opts.pollingIntervalS * 1000);
          continue;
        }
        if (held !== job) heldSince = Date.now();
        held = job;
        try {
          await deliver(job.data.mailId, job.retryCount >= job.retryLimit);
          await b.complete(MAIL_JOB, job.id);
        } catch (err) {
          // Retried later with backoff; after the last try pg-boss moves it to the dead letter queue.
          await b.fail(MAIL_JOB, job.id, { reason: describeMailError(err) });
        }
        held = null;
      } catch (err) {
        // The database is away (or the job vanished): wait a poll and try the held job again.
        logger.warn({ err: { message: (err as Error).message } }, "mail worker: job queue unavailable");
        await pause(opts.pollingIntervalS * 1000);
      }
    }
  }

  /**
   * Writes the message; pass the transaction that creates what it is about. Call notify after commit
   * (a "preparing" message is handed over by whatever finishes it, server/api/reports/report-pdf-job.ts).
   */
  async function queue(mail: Queueable, tx: Db | Tx = db): Promise<string> {
    const [row] = await tx
      .insert(outgoingMail)
      .values({
        companyId: mail.companyId ?? null,
        kind: mail.kind,
        subjectId: mail.subjectId ?? null,
        state: mail.preparing ? "preparing" : "queued",
        to: Array.isArray(mail.to) ? mail.to : [mail.to],
        subject: mail.subject,
        text: mail.text,
        html: mail.html ?? null,
        attachments: (mail.attachments ?? []).map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          contentBase64: a.content.toString("base64"),
        })),
      })
      .returning({ id: outgoingMail.id });
    return row.id;
  }

  /** Hands a queued message to the job queue (no-op without a running worker: the sweep or drain sends it). */
  async function notify(id: string): Promise<void> {
    if (!boss) return;
    try {
      const jobId = await boss.send(MAIL_JOB, { mailId: id });
      wake?.(); // this process's worker looks at once instead of at its next poll
      if (jobId)
        await db
          .update(outgoingMail)
          .set({ jobId })
          .where(and(eq(outgoingMail.id, id), isNull(outgoingMail.jobId)));
    } catch (err) {
      // The row is committed: the periodic sweep hands it over later.
      logger.warn({ err: { message: (err as Error).message }, mailId: id }, "mail queued; job hand-over deferred");
    }
  }

  /** One delivery attempt. `final` marks the last try: a failure then leaves the message failed. */
  async function deliver(id: string, final: boolean): Promise<"sent" | "skipped"> {
    const outcome = unrecorded.get(id);
    if (outcome === "sent") {
      await recordSent(id);
      return "sent";
    }
    if (outcome) await recordFailure(id, outcome);
    const [row] = await db
      .update(outgoingMail)
      .set({ lockedUntil: sql`now() + make_interval(secs => ${LEASE_S})`, attempts: sql`${outgoingMail.attempts} + 1` })
      .where(
        and(
          eq(outgoingMail.id, id),
          eq(outgoingMail.state, "queued"),
          or(isNull(outgoingMail.lockedUntil), lt(outgoingMail.lockedUntil, sql`now()`)),
        ),
      )
      .returning();
    if (!row) return "skipped";
    try {
      await transport.send({
        to: row.to,
        subject: row.subject,
        text: row.text,
        html: row.html ?? undefined,
        companyId: row.companyId,
        messageId: `<${row.id}@plumeline.mail>`,
        attachments: row.attachments.map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          content: Buffer.from(a.contentBase64, "base64"),
        })),
      });
    } catch (err) {
      const failure = { reason: describeMailError(err), final };
      unrecorded.set(id, failure);
      logger.warn({ mailId: id, attempt: row.attempts, ...failure }, "mail delivery failed");
      await recordFailure(id, failure);
      throw err;
    }
    unrecorded.set(id, "sent");
    await recordSent(id);
    return "sent";
  }

  /**
   * Outcomes the database did not take yet (it went away between the SMTP answer and the update): a
   * message the server accepted is never sent twice, and a failed one is not locked for a lease.
   */
  const unrecorded = new Map<string, "sent" | { reason: string; final: boolean }>();

  async function recordFailure(id: string, failure: { reason: string; final: boolean }) {
    await db
      .update(outgoingMail)
      .set({ lastError: failure.reason, lockedUntil: null, state: failure.final ? "failed" : "queued" })
      .where(eq(outgoingMail.id, id));
    unrecorded.delete(id);
  }

  /** Sent: keep who, what and when; drop the body (it may hold a sign-in link) and the attachment. */
  async function recordSent(id: string) {
    await db
      .update(outgoingMail)
      .set({
        state: "sent",
        sentAt: new Date(),
        lockedUntil: null,
        lastError: null,
        text: "",
        html: null,
        attachments: [],
      })
      .where(eq(outgoingMail.id, id));
    unrecorded.delete(id);
  }

  /** Rows committed but never handed to the job queue (a crash between commit and hand-over). */
  async function sweep(): Promise<void> {
    const rows = await db
      .select({ id: outgoingMail.id })
      .from(outgoingMail)
      .where(
        and(
          eq(outgoingMail.state, "queued"),
          isNull(outgoingMail.jobId),
          lt(outgoingMail.createdAt, sql`now() - interval '30 seconds'`),
        ),
      )
      .limit(100);
    for (const r of rows) await notify(r.id);
  }

  return {
    queue,
    notify,
    deliver,
    /** Queues and hands over at once: the request may answer as soon as this resolves. */
    async send(mail: Queueable): Promise<string> {
      const id = await queue(mail);
      await notify(id);
      return id;
    },
    /** Puts a failed message back in the queue as it was (no new invitation, no new token). */
    async retry(id: string): Promise<boolean> {
      const done = await db
        .update(outgoingMail)
        .set({ state: "queued", attempts: 0, lastError: null, jobId: null, lockedUntil: null })
        .where(and(eq(outgoingMail.id, id), eq(outgoingMail.state, "failed")))
        .returning({ id: outgoingMail.id });
      if (done.length) await notify(id);
      return done.length > 0;
    },
    /** Tests: one attempt at every queued message now, oldest first; resolves with how many were sent. */
    async drain(): Promise<number> {
      const rows = await db
        .select({ id: outgoingMail.id })
        .from(outgoingMail)
        .where(eq(outgoingMail.state, "queued"))
        .orderBy(asc(outgoingMail.createdAt));
      let sent = 0;
      for (const r of rows) if ((await deliver(r.id, false)) === "sent") sent++;
      return sent;
    },
    /** Starts the pg-boss worker on the app's own pool (pg-boss keeps its tables in schema `pgboss`). */
    async start(): Promise<void> {
      const pool = db.$client;
      boss = new PgBoss({
        db: { executeSql: (text: string, values: unknown[]) => pool.query(text, values) },
        schedule: false,
      });
      // pg-boss reports failed polls (a database restart) as events; without a listener they would crash the process.
      boss.on("error", (err) => logger.warn({ err: { message: err.message } }, "job queue error"));
      await boss.start();
      await boss.createQueue(MAIL_DEAD_LETTER);
      const queueOptions = {
        name: MAIL_JOB,
        retryLimit: opts.retryLimit,
        retryDelay: opts.retryDelayS,
        retryBackoff: true,
        expireInSeconds: LEASE_S,
        deadLetter: MAIL_DEAD_LETTER,
      };
      if (await boss.getQueue(MAIL_JOB)) await boss.updateQueue(MAIL_JOB, queueOptions);
      else await boss.createQueue(MAIL_JOB, queueOptions);
      // Our own fetch loop rather than boss.work(): pg-boss 10's worker does not await its
      // complete/fail calls, so a database outage mid-job became an unhandled rejection (a crash).
      loop = runLoop(boss);
      const runSweep = () =>
        sweep().catch((err) => logger.warn({ err: { message: err.message } }, "mail sweep failed"));
      sweepTimer = setInterval(runSweep, 30_000);
      sweepTimer.unref();
      await runSweep();
    },
    /** Stops taking jobs and lets the running delivery finish (bounded). */
    async stop(timeoutMs = 10_000): Promise<void> {
      if (sweepTimer) clearInterval(sweepTimer);
      sweepTimer = null;
      const b = boss;
      boss = null;
      wake?.();
      // The delivery under way finishes (its SMTP attempt is bounded by the transport's timeouts).
      if (loop) await Promise.race([loop, new Promise((r) => setTimeout(r, timeoutMs).unref())]);
      loop = null;
      if (b) await b.stop({ graceful: true, wait: true, timeout: timeoutMs });
    },
    close() {
      transport.close();
    },
  };
}

export type MailQueue = ReturnType<typeof createMailQueue>;
