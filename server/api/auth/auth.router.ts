import { Router } from "express";
import { ipKeyGenerator, rateLimit } from "express-rate-limit";
import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import {
  passwordResetConfirmInput,
  passwordResetRequestInput,
  profileUpdateInput,
  signInInput,
  switchCompanyInput,
  type ProfileUpdateInput,
} from "#core/contracts/auth";
import { users } from "../../db/schema/index";
import { HttpError } from "../../lib/http-error";
import { readAuth, requireUser } from "../../middleware/auth";
import { rotateCsrfToken } from "../../middleware/csrf";
import { validate } from "../../middleware/validate";
import {
  confirmPasswordReset,
  endSession,
  requestPasswordReset,
  startSession,
  verifyCredentials,
} from "./auth.service";
import { listMemberships, sessionInfo } from "./session-info";

export function authRouter(ctx: AppContext): Router {
  const router = Router();
  const minutes = Math.ceil(ctx.config.loginRateWindowMs / 60000);
  const limiter = rateLimit({
    windowMs: ctx.config.loginRateWindowMs,
    limit: ctx.config.loginRateLimit,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    // Count per address and e-mail, so one person mistyping does not lock out a whole store's Wi-Fi.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? "")}|${String(req.body?.email ?? "").toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json({
        error: {
          code: "rate_limited",
          message: `Too many sign-in attempts. Wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`,
        },
      });
    },
  });

  router.get("/auth/session", async (req, res) => {
    res.json(await sessionInfo(ctx, req));
  });

  router.post("/auth/sign-in", limiter, validate(signInInput), async (req, res) => {
    const user = await verifyCredentials(ctx, req.body.email, req.body.password);
    await startSession(ctx, req, user.id);
    req.auth = await readAuth(ctx.db, req.session);
    res.json(await sessionInfo(ctx, req));
  });

  router.post("/auth/sign-out", async (req, res) => {
    await endSession(req);
    req.auth = undefined;
    res.json(await sessionInfo(ctx, req));
  });

  router.post("/auth/password-reset", validate(passwordResetRequestInput), async (req, res) => {
    res.status(202).json({ ok: true });
    // Not awaited: the answer must not tell, by its timing, whether the address has an account.
    requestPasswordReset(ctx, req.body.email).catch((err) => ctx.logger.error({ err }, "password reset mail failed"));
  });

  router.post("/auth/password-reset/confirm", validate(passwordResetConfirmInput), async (req, res) => {
    await confirmPasswordReset(ctx, req.body.token, req.body.password, req.sessionID);
    res.status(204).end();
  });

  router.post("/auth/switch-company", requireUser, validate(switchCompanyInput), async (req, res) => {
    const list = await listMemberships(ctx, req.auth!.user.id);
    if (!list.some((m) => m.companyId === req.body.companyId))
      throw new HttpError(404, "not_found", "That company was not found.");
    req.session.activeCompanyId = req.body.companyId;
    rotateCsrfToken(req);
    req.auth = await readAuth(ctx.db, req.session);
    res.json(await sessionInfo(ctx, req));
  });

  router.patch("/profile", requireUser, validate(profileUpdateInput), async (req, res) => {
    const input = req.body as ProfileUpdateInput;
    await ctx.db.update(users).set(input).where(eq(users.id, req.auth!.user.id));
    req.auth!.user = { ...req.auth!.user, ...input };
    res.json(await sessionInfo(ctx, req));
  });

  return router;
}
