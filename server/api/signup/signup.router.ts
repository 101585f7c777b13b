import { Router } from "express";
import type { AppContext } from "../../context";
import { confirmSignUpInput, signUpInput } from "#core/contracts/signup";
import { clientKey, takeAttempt, type AttemptLimit } from "../../lib/attempt-limiter";
import { readAuth } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { startSession } from "../auth/auth.service";
import { sessionInfo } from "../auth/session-info";
import { confirmSignUp, requestSignUp } from "./signup.service";

const HOUR_MS = 60 * 60 * 1000;
// Each sign-up mails an address someone typed: a few an hour per client and per address, counted
// in PostgreSQL so the limits hold across processes (docs/decisions/0021).
const PER_CLIENT: AttemptLimit = { name: "sign-up:client", limit: 10, windowMs: HOUR_MS };
const PER_ADDRESS: AttemptLimit = { name: "sign-up:email", limit: 3, windowMs: HOUR_MS };

export function signupRouter(ctx: AppContext): Router {
  const router = Router();

  router.post("/signup", validate(signUpInput), async (req, res) => {
    await takeAttempt(ctx, PER_CLIENT, clientKey(req), "sign-ups from here");
    await takeAttempt(ctx, PER_ADDRESS, req.body.email, "sign-ups for this address");
    await requestSignUp(ctx, req.body);
    res.status(202).json({ ok: true });
  });

  router.post("/signup/confirm", validate(confirmSignUpInput), async (req, res) => {
    const { userId, companyId } = await confirmSignUp(ctx, req.body.token);
    await startSession(ctx, req, userId, companyId);
    req.auth = await readAuth(ctx.db, req.session);
    res.json(await sessionInfo(ctx, req));
  });

  return router;
}
