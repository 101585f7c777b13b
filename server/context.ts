import type pg from "pg";
import type { Logger } from "pino";
import type { Db } from "./db/client";
import type { Mailer } from "./mail/mailer";

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
  /** Serve the built client from dist/client (off in API-only tests). */
  serveClient: boolean;
}

/** Everything a request handler may reach; built once and passed to createApp. */
export interface AppContext {
  db: Db;
  pool: pg.Pool;
  mailer: Mailer;
  config: AppConfig;
  logger: Logger;
}
