import { Router } from "express";
import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { securityLogRouter } from "./security-log.router";
import { companySettingsInput, type CompanySettings } from "#core/contracts/company";
import { companies } from "../../db/schema/index";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";

async function readSettings(ctx: AppContext, companyId: string): Promise<CompanySettings> {
  const [c] = await ctx.db.select().from(companies).where(eq(companies.id, companyId));
  return {
    name: c.name,
    lengthUnit: c.lengthUnit,
    massUnit: c.massUnit,
    numberFormat: c.numberFormat,
    ruleProfile: c.ruleProfile,
    leakRateMethod: c.leakRateMethod,
    detectorCheckIntervalDays: c.detectorCheckIntervalDays,
    paperSize: c.paperSize,
  };
}

export function companyRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/company/settings", requireMember(), async (req, res) => {
    res.json(await readSettings(ctx, member(req).companyId));
  });

  router.put(
    "/company/settings",
    requireMember("settings.manage"),
    validate(companySettingsInput),
    async (req, res) => {
      const companyId = member(req).companyId;
      await ctx.db
        .update(companies)
        .set(req.body as Partial<CompanySettings>)
        .where(eq(companies.id, companyId));
      res.json(await readSettings(ctx, companyId));
    },
  );

  router.use(securityLogRouter(ctx));
  return router;
}
