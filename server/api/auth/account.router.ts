import { Router } from "express";
import { eq } from "drizzle-orm";
import { z } from "zod";
import type { AppContext } from "../../context";
import { passwordChangeInput, type PasswordChangeInput } from "#core/contracts/auth";
import { text } from "#core/contracts/text";
import { users } from "../../db/schema/index";
import { type AttemptLimit, giveBackAttempt, takeAttempt } from "../../lib/attempt-limiter";
import { badRequest, notFound } from "../../lib/http-error";
import { requireUser } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { hashPassword } from "./auth.service";
import { bcryptCompare } from "../../jobs/passwords";
import { logSecurityEvent } from "../../lib/security-log";
import { endUserSession, endUserSessions, listUserSessions } from "./user-sessions";

const sessionParam = z.object({ id: text().min(16, "is not a session of yours").max(64) });

/** The signed-in person's own account: password, sessions, signing out elsewhere. */
export function accountRouter(ctx: AppContext): Router {
  const router = Router();
  // Guessing the current password from a stolen session is limited like sign-in.
  const guesses: AttemptLimit = {
    name: "password-change:user",
    limit: ctx.config.loginRateLimit,
    windowMs: ctx.config.loginRateWindowMs,
  };

  router.post("/profile/password", requireUser, validate(passwordChangeInput), async (req, res) => {
    const input = req.body as PasswordChangeInput;
    const userId = req.auth!.user.id;
    await takeAttempt(ctx, guesses, userId, "password attempts");
    const [user] = await ctx.db.select().from(users).where(eq(users.id, userId));
    if (!(await bcryptCompare(input.currentPassword, user.passwordHash)))
      throw badRequest("Please check: currentPassword does not match.", {
        currentPassword: "does not match your current password",
      });
    await giveBackAttempt(ctx, guesses, userId);
    await ctx.db
      .update(users)
      .set({ passwordHash: await hashPassword(ctx, input.newPassword) })
      .where(eq(users.id, userId));
    // Whoever else had the old password is signed out; this session stays.
    await endUserSessions(ctx, userId, req.sessionID);
    await logSecurityEvent(ctx, req, { kind: "password-changed", companyId: null, userId });
    res.status(204).end();
  });

  router.get("/profile/sessions", requireUser, async (req, res) => {
    res.json({ sessions: await listUserSessions(ctx, req.auth!.user.id, req.sessionID) });
  });

  router.delete("/profile/sessions/:id", requireUser, validate(sessionParam, "params"), async (req, res) => {
    if (!(await endUserSession(ctx, req.auth!.user.id, res.locals.params.id))) throw notFound("That session");
    res.status(204).end();
  });

  router.post("/profile/sessions/end-others", requireUser, async (req, res) => {
    await endUserSessions(ctx, req.auth!.user.id, req.sessionID);
    res.status(204).end();
  });

  return router;
}
