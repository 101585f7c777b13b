import pino from "pino";
import type { Env } from "./env";
import type { AppContext } from "./context";
import { createDb, migrateDb } from "./db/client";
import { createSmtpMailer } from "./mail/mailer";
import { createMailQueue } from "./mail/mail-queue";
import { startFakeSmtp, type FakeSmtp } from "./mail/fake-smtp";
import { createLifecycle } from "./lifecycle";
import { storageFromEnv } from "./storage/storage-from-env";
import { createJobQueue } from "./jobs/job-queue";
import { startJobs } from "./jobs/job-kinds";
import { closeCpuPool, configureCpuPool } from "./jobs/cpu-pool";
import { startPruning } from "./jobs/pruning";

/** The fake SMTP server on its usual port, or any free one when another checkout already has it. */
async function startFakeSmtpOnFreePort(db: Parameters<typeof startFakeSmtp>[0], port: number): Promise<FakeSmtp> {
  try {
    return await startFakeSmtp(db, port);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "EADDRINUSE" || port === 0) throw err;
    return startFakeSmtp(db, 0);
  }
}

export interface Runtime {
  ctx: AppContext;
  fakeSmtp: FakeSmtp | null;
  close(): Promise<void>;
}

/** Connects, migrates, starts the fake SMTP server when no real one is configured, and builds the context. */
export async function bootstrap(env: Env, overrides: { appUrl?: string } = {}): Promise<Runtime> {
  const logger = pino({ level: env.LOG_LEVEL });
  // A database restart breaks idle pooled connections: log it and let the pool make new ones.
  const { pool, db } = createDb(env.DATABASE_URL, {
    onConnectionError: (err) => logger.warn({ err: { message: err.message } }, "database connection lost"),
  });
  await migrateDb(db);

  const fakeSmtp = env.SMTP_HOST ? null : await startFakeSmtpOnFreePort(db, env.FAKE_SMTP_PORT);
  const transport = createSmtpMailer(
    {
      host: env.SMTP_HOST ?? "127.0.0.1",
      port: fakeSmtp ? fakeSmtp.port : env.SMTP_PORT,
      secure: env.SMTP_SECURE === "true",
      user: env.SMTP_USER,
      pass: env.SMTP_PASS,
      from: env.MAIL_FROM,
      timeoutMs: env.SMTP_TIMEOUT_MS,
    },
    Boolean(fakeSmtp),
  );
  const mailer = createMailQueue(db, transport, logger, {
    retryLimit: env.MAIL_RETRY_LIMIT,
    retryDelayS: env.MAIL_RETRY_DELAY_S,
    pollingIntervalS: env.JOB_POLL_INTERVAL_S,
  });
  // Every process runs the mail worker: any of them may deliver any message.
  await mailer.start();
  // Every process takes the daily pruning job too (pg-boss hands each day's job to one of them).
  const pruning = await startPruning(
    db,
    logger,
    {
      securityLog: env.SECURITY_LOG_RETENTION_DAYS,
      sentMail: env.MAIL_SENT_RETENTION_DAYS,
      failedMail: env.MAIL_FAILED_RETENTION_DAYS,
    },
    { pollingIntervalS: Math.max(env.JOB_POLL_INTERVAL_S, 30) },
  );

  configureCpuPool({
    maxThreads: env.CPU_WORKERS,
    maxQueue: env.CPU_QUEUE_MAX,
    taskTimeoutMs: env.CPU_TASK_TIMEOUT_MS,
    maxHeapMb: env.CPU_WORKER_HEAP_MB,
    niceIncrement: env.CPU_WORKER_NICE,
  });
  const uploads = storageFromEnv(env);
  logger.info({ storage: uploads.kind }, "uploads storage");
  const ctx: AppContext = {
    db,
    pool,
    mailer,
    logger,
    lifecycle: createLifecycle(),
    storage: uploads.storage,
    config: {
      sessionSecret: env.SESSION_SECRET,
      bcryptCost: env.BCRYPT_COST,
      loginRateLimit: env.LOGIN_RATE_LIMIT,
      loginRateWindowMs: env.LOGIN_RATE_WINDOW_MS,
      appUrl: overrides.appUrl ?? env.APP_URL ?? `http://${env.HOST}:${env.PORT}`,
      outboxEnabled: Boolean(fakeSmtp),
      uploadsDir: env.UPLOADS_DIR,
      planImageLimits: { maxPixels: Math.round(env.PLAN_MAX_MEGAPIXELS * 1_000_000) },
      decodeQueue: {
        concurrency: env.DECODE_CONCURRENCY,
        queueMax: env.DECODE_QUEUE_MAX,
        maxWaitMs: env.DECODE_WAIT_MS,
      },
      uploadTmpDir: env.UPLOAD_TMP_DIR,
      secureCookies: (env.APP_URL ?? "").startsWith("https://"),
      syncThrottle: { limit: env.SYNC_RATE_LIMIT, windowMs: env.SYNC_RATE_WINDOW_MS },
      trustProxy: env.TRUST_PROXY,
      serveClient: true,
    },
  };

  // Every process runs the job worker too: analyses and digests queued by any process.
  const jobs = createJobQueue(db, logger, {
    pollingIntervalS: env.JOB_POLL_INTERVAL_S,
    maintenanceIntervalS: env.JOB_MAINTENANCE_INTERVAL_S,
  });
  await startJobs(ctx, jobs, { work: env.RUN_JOBS === "true" });

  return {
    ctx,
    fakeSmtp,
    async close() {
      await jobs.stop();
      await pruning.stop();
      await mailer.stop();
      await ctx.analysisRunner?.close();
      await ctx.reportRunner?.close();
      await closeCpuPool();
      mailer.close();
      uploads.close();
      await fakeSmtp?.close();
      await pool.end();
    },
  };
}
