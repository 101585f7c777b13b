import os from "node:os";
import { z } from "zod";

// All configuration comes from the environment, checked once at start-up with a clear message.
// Which proxies' X-Forwarded-For/-Proto are believed: "false" (none, the default), a hop count, or a
// comma-separated list of addresses, subnets and Express's names (loopback, linklocal, uniquelocal).
const proxyEntry = z.union([
  z.enum(["loopback", "linklocal", "uniquelocal"]),
  z.ipv4(),
  z.ipv6(),
  z.cidrv4(),
  z.cidrv6(),
]);
const trustProxySchema = z
  .string()
  .trim()
  .default("false")
  .transform((v, c): false | number | string[] => {
    if (v === "false" || v === "") return false;
    if (/^\d+$/.test(v) && Number(v) >= 1 && Number(v) <= 10) return Number(v);
    const list = v.split(",").map((s) => s.trim());
    if (list.every((s) => proxyEntry.safeParse(s).success)) return list;
    c.addIssue({
      code: "custom",
      message: "must be false, a hop count from 1 to 10, or a comma-separated list of proxy addresses or subnets",
    });
    return z.NEVER;
  });

const CORES = os.availableParallelism();

const envSchema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    DATABASE_URL: z.string().min(1, "DATABASE_URL is required (postgres://user@host:port/db)"),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    HOST: z.string().default("127.0.0.1"),
    APP_URL: z.string().optional(),
    SESSION_SECRET: z
      .string()
      .min(16, "SESSION_SECRET must be at least 16 characters")
      .default("plumeline-local-development-secret"),
    BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
    TRUST_PROXY: trustProxySchema,
    LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
    LOGIN_RATE_WINDOW_MS: z.coerce
      .number()
      .int()
      .min(1000)
      .default(15 * 60 * 1000),
    // Without SMTP_HOST the server starts its own fake SMTP server and keeps what it catches (the Outbox).
    SMTP_HOST: z.string().optional(),
    SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
    SMTP_USER: z.string().optional(),
    SMTP_PASS: z.string().optional(),
    SMTP_SECURE: z.enum(["true", "false"]).default("false"),
    MAIL_FROM: z.string().default("Plumeline <no-reply@plumeline.local>"),
    // A mail server that does not answer fails the attempt after this long; the queue retries it.
    SMTP_TIMEOUT_MS: z.coerce.number().int().min(500).max(120_000).default(10_000),
    // Outgoing mail: retries after the first try, and the base delay (doubled per retry, with jitter).
    MAIL_RETRY_LIMIT: z.coerce.number().int().min(0).max(30).default(8),
    MAIL_RETRY_DELAY_S: z.coerce.number().int().min(1).max(3600).default(30),
    // How often an idle worker asks the job queue for work (pg-boss's minimum is 0.5 s).
    JOB_POLL_INTERVAL_S: z.coerce.number().min(0.5).max(60).default(2),
    // How often pg-boss hands out again the jobs of a worker that died (past their time limit).
    // "false": this process queues analyses and digests but leaves running them to the others.
    RUN_JOBS: z.enum(["true", "false"]).default("true"),
    JOB_MAINTENANCE_INTERVAL_S: z.coerce.number().int().min(1).max(3600).default(60),
    FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
    UPLOADS_DIR: z.string().default("uploads"),
    // Where uploads live: "disk" (UPLOADS_DIR, one machine) or "s3" (any S3-compatible object store,
    // shared by every app process).
    STORAGE: z.enum(["disk", "s3"]).default("disk"),
    S3_BUCKET: z.string().min(1).optional(),
    S3_ENDPOINT: z.url("S3_ENDPOINT must be a URL such as http://127.0.0.1:9000").optional(),
    S3_REGION: z.string().min(1).default("us-east-1"),
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("true"),
    S3_PREFIX: z.string().optional(),
    // Plan images: the most pixels a header may declare before it is refused undecoded (decompression bombs).
    PLAN_MAX_MEGAPIXELS: z.coerce
      .number()
      .positive("PLAN_MAX_MEGAPIXELS must be more than 0")
      .max(200, "PLAN_MAX_MEGAPIXELS must be at most 200")
      .default(40),
    // The one CPU worker pool (server/jobs/cpu-pool.ts, docs/decisions/0080): workers at most (one
    // per core by default and never more: the work is CPU-bound; long tasks leave one worker to
    // password checks), tasks waiting at most (beyond it 503), the time limit per task, and each
    // worker's JavaScript heap.
    CPU_WORKERS: z.coerce
      .number()
      .int()
      .min(1, "CPU_WORKERS must be at least 1")
      .max(CORES, `CPU_WORKERS must be at most ${CORES}, the cores of this machine`)
      .default(CORES),
    CPU_QUEUE_MAX: z.coerce.number().int().min(0).max(10_000).default(100),
    CPU_TASK_TIMEOUT_MS: z.coerce.number().int().min(1000).max(600_000).default(120_000),
    CPU_WORKER_HEAP_MB: z.coerce.number().int().min(64).max(4096).default(512),
    CPU_WORKER_NICE: z.coerce.number().int().min(0).max(19).default(0),
    // Uploaded images decoded at once, uploads waiting for that, and how long one may wait (beyond
    // either, 503); docs/decisions/0081.
    DECODE_CONCURRENCY: z.coerce.number().int().min(1).max(8).default(1),
    DECODE_QUEUE_MAX: z.coerce.number().int().min(0).max(1000).default(16),
    DECODE_WAIT_MS: z.coerce.number().int().min(1000).max(600_000).default(60_000),
    // Where uploads stream to while their request runs (default: the system's temp folder).
    UPLOAD_TMP_DIR: z.string().min(1).optional(),
    // Pruning, once a day (server/jobs/pruning.ts, docs/decisions/0082): security log rows older than
    // this (at least a year and a day, so a whole year is always visible), sent mail, failed mail.
    SECURITY_LOG_RETENTION_DAYS: z.coerce
      .number()
      .int()
      .min(366, "SECURITY_LOG_RETENTION_DAYS must be at least 366, so a whole year stays visible")
      .max(36_500)
      .default(400),
    MAIL_SENT_RETENTION_DAYS: z.coerce.number().int().min(1).max(36_500).default(90),
    MAIL_FAILED_RETENTION_DAYS: z.coerce.number().int().min(1).max(36_500).default(365),
    LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
    SEED_DEMO: z.enum(["true", "false"]).default("true"),
    // Walk sync writes per member per window; over it the answer is 503 with Retry-After.
    SYNC_RATE_LIMIT: z.coerce.number().int().min(1).default(600),
    SYNC_RATE_WINDOW_MS: z.coerce.number().int().min(1000).default(60_000),
    // On SIGTERM: how long in-flight requests and jobs may run before they are cut off.
    SHUTDOWN_GRACE_MS: z.coerce.number().int().min(0).max(600_000).default(20_000),
    // On SIGTERM: how long to keep serving while /readyz already says "draining", so a load balancer
    // stops sending new requests before the listener closes.
    SHUTDOWN_DELAY_MS: z.coerce.number().int().min(0).max(60_000).default(0),
    // How long an idle keep-alive connection stays open: longer than a proxy's idle timeout (often 60 s).
    KEEP_ALIVE_TIMEOUT_MS: z.coerce.number().int().min(1_000).max(600_000).default(65_000),
  })
  .superRefine((env, ctx) => {
    if (env.STORAGE === "s3" && !env.S3_BUCKET) {
      ctx.addIssue({ code: "custom", path: ["S3_BUCKET"], message: "S3_BUCKET is required when STORAGE is s3" });
    }
  });

export type Env = z.infer<typeof envSchema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join("\n")}`);
  }
  return parsed.data;
}
