import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import { reportPaper } from "#core/domain/reports/paper";
import { acceptedReadingTexts } from "../compliance/reading-acceptances";
import { rulesOfSettings, type CompanyRules } from "../compliance/system-records";
import type { StatementOptions } from "./leak-rate-statement";

/** What every statement and records CSV of a company is built with: its rules and how it prints. */
export interface StatementSettings {
  rules: CompanyRules;
  statement: Omit<StatementOptions, "generatedAt">;
}

/**
 * The company's rules, mass unit, number format, paper and accepted readings, from one read of
 * its row (a custom profile and the acceptances come from their own tables).
 */
export async function statementSettings(ctx: AppContext, companyId: string): Promise<StatementSettings> {
  const [c] = await ctx.db
    .select({
      ruleProfile: companies.ruleProfile,
      method: companies.leakRateMethod,
      number: companies.numberFormat,
      mass: companies.massUnit,
      paperSize: companies.paperSize,
    })
    .from(companies)
    .where(eq(companies.id, companyId));
  const rules = await rulesOfSettings(ctx, companyId, c);
  return {
    rules,
    statement: {
      paper: reportPaper(c?.paperSize ?? "profile", rules.profile),
      massUnit: c?.mass ?? "kg",
      numberFormat: c?.number ?? "1,234.5",
      acceptedReadings: await acceptedReadingTexts(ctx, companyId, rules.profile),
    },
  };
}
