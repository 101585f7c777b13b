import type pg from "pg";
import type { Logger } from "pino";
import type { Db } from "./db/client";
import type { MailQueue } from "./mail/mail-queue";
import type { JobQueue } from "./jobs/job-queue";
import type { BlobStorage } from "./storage/blob-storage";
import type { AnalysisRunner } from "./jobs/analysis-runner";
import type { ReportRunner } from "./jobs/report-runner";
import type { Lifecycle } from "./lifecycle";

/** Plan upload limits; each has a default (server/api/plans/plan-resources.ts). */
export interface PlanImageLimits {
  /** Largest upload in bytes (25 MB, docs/product.md). */
  maxBytes: number;
  /** Largest decoded image, width × height, checked from the header before decoding. */
  maxPixels: number;
  /** Longest side of the display copy the editor draws on. */
  displayMaxSide: number;
  thumbMaxSide: number;
}

export interface AppConfig {
  sessionSecret: string;
  bcryptCost: number;
  loginRateLimit: number;
  loginRateWindowMs: number;
  /** Base URL used in links sent by e-mail. */
  appUrl: string;
  /** True when mail goes to the built-in fake SMTP server, whose catch the Outbox shows. */
  outboxEnabled: boolean;
  uploadsDir: string;
  secureCookies: boolean;
  /** Express "trust proxy": false (default: believe no X-Forwarded-* header), a hop count, or addresses. */
  trustProxy?: false | number | string[];
  /** Password-reset request limits; defaults in server/api/auth/auth.router.ts. */
  resetRateLimit?: { perAddress?: number; perClient?: number; windowMs?: number };
  /** Serve the built client from dist/client (off in API-only tests). */
  serveClient: boolean;
  planImageLimits?: Partial<PlanImageLimits>;
  /** Images decoded at once and uploads waiting for that (server/api/plans/image-decoder.ts). */
  decodeQueue?: { concurrency?: number; queueMax?: number; maxWaitMs?: number };
  /** Where uploads are written while their request runs (default: the system's temp folder). */
  uploadTmpDir?: string;
  /** Per-member limit on the Walk sync writes (server/middleware/sync-throttle.ts). */
  syncThrottle?: { limit?: number; windowMs?: number };
}

/** Everything a request handler may reach; built once and passed to createApp. */
export interface AppContext {
  db: Db;
  pool: pg.Pool;
  /** The outgoing mail queue: `send` resolves once the message is stored, not once delivered. */
  mailer: MailQueue;
  config: AppConfig;
  logger: Logger;
  /** Where uploads live (server/storage/storage-from-env.ts); tests without one get a disk store under config.uploadsDir. */
  storage?: BlobStorage;
  /** The locator on the process's CPU pool (server/jobs/cpu-pool.ts); made on first use (server/api/analysis). */
  analysisRunner?: AnalysisRunner;
  /** Report PDFs on the process's CPU pool; made on first use (server/api/reports). */
  reportRunner?: ReportRunner;
  /** The background job worker (analyses, digests; server/jobs/job-kinds.ts), in app processes; absent in API tests, which run that work inline. */
  jobs?: JobQueue;
  /** Set while shutting down (server/index.ts); /readyz and keep-alive read it. */
  lifecycle?: Lifecycle;
}
