import type { Request } from "express";
import { asc, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies, memberships } from "../../db/schema/index";
import type { SessionInfo } from "#core/contracts/auth";
import { issueCsrfToken } from "../../middleware/csrf";
import { companyRules } from "../compliance/system-records";
import { profileWording } from "#core/domain/compliance/company-profile";

export async function listMemberships(ctx: AppContext, userId: string) {
  return ctx.db
    .select({ companyId: memberships.companyId, companyName: companies.name, role: memberships.role })
    .from(memberships)
    .innerJoin(companies, eq(companies.id, memberships.companyId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(companies.name));
}

const METRIC = { length: "m", mass: "kg", number: "1,234.5" } as const;

/** What GET /api/auth/session answers; also the reply to every call that changes the session. */
export async function sessionInfo(ctx: AppContext, req: Request): Promise<SessionInfo> {
  const csrfToken = issueCsrfToken(req);
  const auth = req.auth;
  if (!auth)
    return {
      user: null,
      activeCompanyId: null,
      memberships: [],
      csrfToken,
      outboxEnabled: ctx.config.outboxEnabled,
      units: METRIC,
      rules: "us",
    };
  const [company] = auth.membership
    ? await ctx.db
        .select({ length: companies.lengthUnit, mass: companies.massUnit, number: companies.numberFormat })
        .from(companies)
        .where(eq(companies.id, auth.membership.companyId))
    : [METRIC];
  return {
    user: auth.user,
    activeCompanyId: auth.membership?.companyId ?? null,
    memberships: await listMemberships(ctx, auth.user.id),
    csrfToken,
    outboxEnabled: ctx.config.outboxEnabled,
    units: {
      length: auth.user.lengthUnit ?? company.length,
      mass: auth.user.massUnit ?? company.mass,
      number: company.number,
    },
    rules: auth.membership ? profileWording((await companyRules(ctx, auth.membership.companyId)).profile) : "us",
  };
}
