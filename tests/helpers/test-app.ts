import pino from "pino";
import type { Express } from "express";
import request from "supertest";
import { createApp } from "../../server/app";
import type { AppConfig, AppContext } from "../../server/context";
import { createSmtpMailer } from "../../server/mail/mailer";
import { createMailQueue } from "../../server/mail/mail-queue";
import { startFakeSmtp, type FakeSmtp } from "../../server/mail/fake-smtp";
import { prepareReports } from "../../server/api/reports/report-pdf-job";
import { PASSWORD } from "./fixtures";
import { createTestDatabase, type TestDatabase } from "./test-db";

export interface TestApp {
  app: Express;
  ctx: AppContext;
  database: TestDatabase;
  smtp: FakeSmtp;
  close(): Promise<void>;
}

/** The real app on a real, private database with its own fake SMTP server (port 0). */
export async function createTestApp(config: Partial<AppConfig> = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const smtp = await startFakeSmtp(database.db, 0);
  const logger = pino({ level: "silent" });
  // No job-queue worker unless a test starts one: mail waits in the queue until drained (drainMail).
  const mailer = createMailQueue(
    database.db,
    createSmtpMailer(
      {
        host: "127.0.0.1",
        port: smtp.port,
        secure: false,
        from: "Plumeline <no-reply@plumeline.test>",
        timeoutMs: 2_000,
      },
      true,
    ),
    logger,
    // Used when a test starts the worker (the browser suite's server): quick polls and retries.
    { pollingIntervalS: 0.5, retryDelayS: 1, retryLimit: 3 },
  );
  const ctx: AppContext = {
    db: database.db,
    pool: database.pool,
    mailer,
    logger,
    config: {
      sessionSecret: "test-secret-test-secret",
      bcryptCost: 4, // fast in tests; production uses 12
      loginRateLimit: 1000,
      loginRateWindowMs: 60_000,
      appUrl: "http://plumeline.test",
      outboxEnabled: true,
      uploadsDir: "uploads",
      secureCookies: false,
      serveClient: false,
      ...config,
    },
  };
  const app = createApp(ctx);
  return {
    app,
    ctx,
    database,
    smtp,
    async close() {
      await mailer.stop();
      await ctx.analysisRunner?.close();
      await ctx.reportRunner?.close();
      mailer.close();
      await smtp.close();
      await database.drop();
    },
  };
}

/**
 * Makes every sent report's PDF (the job's work, done here in-process) and delivers every queued
 * message now, so a test can read the Outbox right after sending.
 */
export async function drainMail(t: { ctx: AppContext }): Promise<number> {
  await prepareReports(t.ctx);
  return t.ctx.mailer.drain();
}

/** A supertest agent that keeps cookies and sends the session's CSRF token on writes. */
export async function agentFor(app: Express) {
  const agent = request.agent(app);
  const session = await agent.get("/api/auth/session");
  let csrf: string = session.body.csrfToken;
  const remember = (res: request.Response) => {
    if (res.body && typeof res.body.csrfToken === "string") csrf = res.body.csrfToken;
    return res;
  };
  return {
    agent,
    get: (url: string) => agent.get(url).then(remember),
    post: (url: string, body?: object) =>
      agent
        .post(url)
        .set("X-CSRF-Token", csrf)
        .send(body ?? {})
        .then(remember),
    put: (url: string, body?: object) =>
      agent
        .put(url)
        .set("X-CSRF-Token", csrf)
        .send(body ?? {})
        .then(remember),
    patch: (url: string, body?: object) =>
      agent
        .patch(url)
        .set("X-CSRF-Token", csrf)
        .send(body ?? {})
        .then(remember),
    delete: (url: string) => agent.delete(url).set("X-CSRF-Token", csrf).then(remember),
    get csrf() {
      return csrf;
    },
  };
}
export type Agent = Awaited<ReturnType<typeof agentFor>>;

/** A fresh agent signed in as a seeded person (the sign-in is asserted, so a typo fails loudly). */
export async function signIn(app: Express, person: { email: string }, password = PASSWORD): Promise<Agent> {
  const a = await agentFor(app);
  const res = await a.post("/api/auth/sign-in", { email: person.email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${person.email} gave ${res.status}: ${JSON.stringify(res.body)}`);
  return a;
}

/** Like signIn, but one agent per person for the whole file: faster when nothing signs out. */
export function signInOnce(app: () => Express): (person: { email: string }) => Promise<Agent> {
  const agents = new Map<string, Promise<Agent>>();
  return (person) => {
    let a = agents.get(person.email);
    if (!a) agents.set(person.email, (a = signIn(app(), person)));
    return a;
  };
}
