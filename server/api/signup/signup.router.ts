import { Router } from "express";
import { rateLimit } from "express-rate-limit";
import type { AppContext } from "../../context";
import { confirmSignUpInput, signUpInput } from "#core/contracts/signup";
import { readAuth } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { startSession } from "../auth/auth.service";
import { sessionInfo } from "../auth/session-info";
import { confirmSignUp, requestSignUp } from "./signup.service";

export function signupRouter(ctx: AppContext): Router {
  const router = Router();
  // A few sign-ups an hour per client: each one sends a mail to an address someone typed.
  const limiter = rateLimit({
    windowMs: 60 * 60 * 1000,
    limit: 10,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({
        error: { code: "rate_limited", message: "Too many sign-ups from here. Wait an hour and try again." },
      });
    },
  });

  router.post("/signup", limiter, validate(signUpInput), async (req, res) => {
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
