import { Router } from "express";
import type { AppContext } from "../../context";
import { ruleProfileSchema, startCustomProfileInput, type RuleProfileInput } from "#core/contracts/rule-profile";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { readCustomProfile, saveCustomProfile, startFrom } from "./custom-profile.service";

/** The company's custom rule profile: every member reads it, owners (settings.manage) edit it. */
export function customProfileRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/company/custom-profile", requireMember(), async (req, res) => {
    res.json(await readCustomProfile(ctx, member(req).companyId));
  });

  router.post(
    "/company/custom-profile/start",
    requireMember("settings.manage"),
    validate(startCustomProfileInput),
    async (req, res) => {
      const m = member(req);
      res
        .status(201)
        .json(
          await startFrom(ctx, m.companyId, req.auth!.user.id, (req.body as { from: "us-federal" | "eu-fgas" }).from),
        );
    },
  );

  router.put(
    "/company/custom-profile",
    requireMember("settings.manage"),
    validate(ruleProfileSchema),
    async (req, res) => {
      const m = member(req);
      res.json(await saveCustomProfile(ctx, m.companyId, req.auth!.user.id, req.body as RuleProfileInput));
    },
  );

  return router;
}
