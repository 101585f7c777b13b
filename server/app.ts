import express, { type Express } from "express";
import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import { pinoHttp } from "pino-http";
import { randomUUID } from "node:crypto";
import path from "node:path";
import fs from "node:fs";
import "./middleware/session-types";
import type { AppContext } from "./context";
import { loadAuth } from "./middleware/auth";
import { csrfProtection } from "./middleware/csrf";
import { errorHandler, notFoundApi } from "./middleware/error-handler";
import { refuseDeepJson } from "./middleware/json-depth";
import { securityHeaders } from "./middleware/security-headers";
import { authRouter } from "./api/auth/auth.router";
import { teamRouter } from "./api/team/team.router";
import { invitationsRouter } from "./api/invitations/invitations.router";
import { signupRouter } from "./api/signup/signup.router";
import { companyRouter } from "./api/company/company.router";
import { customProfileRouter } from "./api/company/custom-profile.router";
import { outboxRouter } from "./api/outbox/outbox.router";
import { storesRouter } from "./api/stores/stores.router";
import { detectorsRouter } from "./api/detectors/detectors.router";
import { systemsRouter } from "./api/systems/systems.router";
import { companyRefrigerantsRouter } from "./api/refrigerants/company-refrigerants.router";
import { plansRouter } from "./api/plans/plans.router";
import { analysisRouter } from "./api/analysis/analysis.router";
import { reportsRouter } from "./api/reports/reports.router";
import { sweepsRouter } from "./api/sweeps/sweeps.router";
import { findingsRouter } from "./api/findings/findings.router";
import { complianceRouter } from "./api/compliance/compliance.router";
import { todayRouter } from "./api/compliance/today.router";
import { exportsRouter } from "./api/exports/exports.router";
import { healthRouter } from "./api/health/health.router";
import { jobsRouter } from "./api/jobs/jobs.router";
import { APP_ROOT } from "./paths";

const CLIENT_DIR = path.join(APP_ROOT, "dist/client");

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", ctx.config.trustProxy ?? false);
  app.use(securityHeaders({ https: ctx.config.secureCookies }));
  app.use(healthRouter(ctx));
  // While draining, each answer closes its connection so clients reconnect to another process.
  app.use((_req, res, next) => {
    if (ctx.lifecycle?.draining) res.set("Connection", "close");
    next();
  });
  app.use(
    pinoHttp({
      logger: ctx.logger,
      // One id per request, unique across processes (logged as reqId, answered as X-Request-Id): a
      // proxy's own X-Request-Id is kept when it is a plain token, so its logs and ours line up.
      genReqId: (req, res) => {
        const given = req.headers["x-request-id"];
        const id = typeof given === "string" && /^[\w.-]{1,64}$/.test(given) ? given : randomUUID();
        res.setHeader("X-Request-Id", id);
        return id;
      },
      autoLogging: { ignore: (req) => !req.url?.startsWith("/api/") },
      // reqId on every line of the request's logger (req.log), so a handler's warning is tied to it.
      customProps: (req) => ({ reqId: req.id, userId: (req as express.Request).session?.userId }),
      serializers: {
        req: (req) => ({ method: req.method, url: req.url }),
        res: (res) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use(express.json({ limit: "5mb", verify: refuseDeepJson }));

  const PgStore = connectPgSimple(session);
  // Only the API has sessions. The rolling cookie is set again on every answer that loaded one: an
  // asset or app-shell answer still in flight when sign-in rotates the session id (a new service
  // worker fetches the whole shell on a first visit, which is when people sign in) would put the
  // old, signed-out cookie back (docs/decisions/0121-sessions-only-on-the-api.md).
  app.use(
    "/api",
    session({
      name: "plumeline.sid",
      store: new PgStore({
        pool: ctx.pool,
        tableName: "session",
        createTableIfMissing: false,
        pruneSessionInterval: 15 * 60,
      }),
      secret: ctx.config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      // Secure when the app URL is https, else whenever the request came over https ("auto": req.secure,
      // which believes X-Forwarded-Proto only from a proxy TRUST_PROXY names).
      cookie: {
        httpOnly: true,
        sameSite: "lax",
        secure: ctx.config.secureCookies ? true : "auto",
        maxAge: 30 * 24 * 60 * 60 * 1000,
      },
    }),
  );

  const api = express.Router();
  api.use(loadAuth(ctx.db));
  api.use(csrfProtection);
  api.use(authRouter(ctx));
  api.use(invitationsRouter(ctx));
  api.use(signupRouter(ctx));
  api.use(teamRouter(ctx));
  api.use(companyRouter(ctx));
  api.use(customProfileRouter(ctx));
  api.use(outboxRouter(ctx));
  api.use(storesRouter(ctx));
  api.use(detectorsRouter(ctx));
  api.use(systemsRouter(ctx));
  api.use(companyRefrigerantsRouter(ctx));
  api.use(plansRouter(ctx));
  api.use(analysisRouter(ctx));
  api.use(reportsRouter(ctx));
  api.use(sweepsRouter(ctx));
  api.use(findingsRouter(ctx));
  api.use(complianceRouter(ctx));
  api.use(todayRouter(ctx));
  api.use(exportsRouter(ctx));
  api.use(jobsRouter(ctx));
  api.use(notFoundApi);
  app.use("/api", api);

  if (ctx.config.serveClient && fs.existsSync(CLIENT_DIR)) {
    app.use(express.static(CLIENT_DIR, { index: false, maxAge: "1h" }));
    // Client-side routes: every other GET gets the app shell.
    app.get("/{*splat}", (_req, res) => {
      res.sendFile(path.join(CLIENT_DIR, "index.html"));
    });
  }
  app.use(errorHandler);
  return app;
}
