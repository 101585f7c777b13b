import { Router } from "express";
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
import { type AttemptLimit, clientKey, giveBackAttempt, takeAttempt } from "../../lib/attempt-limiter";
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
import { accountRouter } from "./account.router";
import { logSecurityEvent } from "../../lib/security-log";

/** Password-reset requests per hour: a few per address, more per client (a shared store Wi-Fi). */
const RESET_LIMITS = { perAddress: 3, perClient: 20, windowMs: 60 * 60 * 1000 };

export function authRouter(ctx: AppContext): Router {
  const router = Router();
  const windowMs = ctx.config.loginRateWindowMs;
  // Counted per client and address (one person mistyping does not lock out a whole store's Wi-Fi), and
  // per address from everywhere at five times that (guessing one password from many clients).
  const perClient: AttemptLimit = { name: "sign-in:client+email", limit: ctx.config.loginRateLimit, windowMs };
  const perAddress: AttemptLimit = { name: "sign-in:email", limit: ctx.config.loginRateLimit * 5, windowMs };
  const reset = { ...RESET_LIMITS, ...ctx.config.resetRateLimit };
  const resetPerAddress: AttemptLimit = { name: "reset:email", limit: reset.perAddress, windowMs: reset.windowMs };
  const resetPerClient: AttemptLimit = { name: "reset:client", limit: reset.perClient, windowMs: reset.windowMs };

  router.get("/auth/session", async (req, res) => {
    res.json(await sessionInfo(ctx, req));
  });

  // After validation: the address is counted as the contract reads it (trimmed, lower-case).
  router.post("/auth/sign-in", validate(signInInput), async (req, res) => {
    const email: string = req.body.email;
    const keys = [`${clientKey(req)}|${email}`, email];
    await takeAttempt(ctx, perClient, keys[0], "sign-in attempts");
    await takeAttempt(ctx, perAddress, keys[1], "sign-in attempts");
    const user = await verifyCredentials(ctx, email, req.body.password, req);
    // Only failures count: a technician signing in on each shift never locks themself out.
    await giveBackAttempt(ctx, perClient, keys[0]);
    await giveBackAttempt(ctx, perAddress, keys[1]);
    await startSession(ctx, req, user.id);
    await logSecurityEvent(ctx, req, { kind: "sign-in", companyId: null, userId: user.id });
    req.auth = await readAuth(ctx.db, req.session);
    res.json(await sessionInfo(ctx, req));
  });

  router.post("/auth/sign-out", async (req, res) => {
    await endSession(req);
    req.auth = undefined;
    res.json(await sessionInfo(ctx, req));
  });

  // Throttled alike whether or not the address has an account, so a 429 tells nothing either.
  router.post("/auth/password-reset", validate(passwordResetRequestInput), async (req, res) => {
    await takeAttempt(ctx, resetPerClient, clientKey(req), "password reset requests");
    await takeAttempt(ctx, resetPerAddress, req.body.email, "password reset requests for this address");
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

  router.use(accountRouter(ctx));
  return router;
}
