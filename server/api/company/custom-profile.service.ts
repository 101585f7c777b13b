import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { CustomProfileView, RuleProfileInput } from "#core/contracts/rule-profile";
import { companies, customRuleProfiles, users } from "../../db/schema/index";
import { startCustomProfile, type BuiltInProfileId } from "#core/domain/compliance/company-profile";
import { validateRuleProfile } from "#core/domain/compliance/custom-profile";
import type { RuleProfile } from "#core/domain/compliance/rule-profile";
import { DomainInputError } from "#core/domain/input-error";
import { badRequest } from "../../lib/http-error";
import { latestCustomProfile } from "../compliance/system-records";

export async function readCustomProfile(ctx: AppContext, companyId: string): Promise<CustomProfileView> {
  const row = await latestCustomProfile(ctx, companyId);
  const [c] = await ctx.db
    .select({ ruleProfile: companies.ruleProfile })
    .from(companies)
    .where(eq(companies.id, companyId));
  const by = row
    ? ((await ctx.db.select({ name: users.name }).from(users).where(eq(users.id, row.savedById)))[0]?.name ?? null)
    : null;
  return {
    profile: row ? (row.profile as RuleProfileInput) : null,
    savedAt: row?.savedAt.toISOString() ?? null,
    savedBy: by,
    inForce: c?.ruleProfile === "custom",
  };
}

/**
 * Stores a new version of the company's custom profile. zod has checked the shape (the router);
 * the domain check runs too, so a profile the rule functions cannot use is never stored.
 */
export async function saveCustomProfile(
  ctx: AppContext,
  companyId: string,
  userId: string,
  profile: RuleProfile,
): Promise<CustomProfileView> {
  try {
    validateRuleProfile(profile);
  } catch (err) {
    if (!(err instanceof DomainInputError)) throw err;
    // The domain names fields as `leakRateParts[0].repairDays`; the client uses dotted paths.
    const field = err.field.replace(/\[(\d+)\]/g, ".$1");
    throw badRequest(`Please check: ${field} ${err.reason}.`, { [field]: err.reason });
  }
  await ctx.db.insert(customRuleProfiles).values({ companyId, profile, savedById: userId });
  return readCustomProfile(ctx, companyId);
}

/** Starts (or starts over) from an unedited copy of a built-in profile. */
export function startFrom(
  ctx: AppContext,
  companyId: string,
  userId: string,
  from: BuiltInProfileId,
): Promise<CustomProfileView> {
  return saveCustomProfile(ctx, companyId, userId, startCustomProfile(from));
}
