import { eq } from "drizzle-orm";
import type { AppContext } from "../context";
import { companies } from "../db/schema/index";
import { reportPaper, type Paper } from "#core/domain/reports/paper";
import type { RuleProfile } from "#core/domain/compliance/rule-profile";

/** The paper every PDF of the company prints on: its setting, or its rule profile's paper by default. */
export async function companyPaper(
  ctx: AppContext,
  companyId: string,
  profile: Pick<RuleProfile, "kind" | "basedOn">,
): Promise<Paper> {
  const [c] = await ctx.db
    .select({ paperSize: companies.paperSize })
    .from(companies)
    .where(eq(companies.id, companyId));
  return reportPaper(c?.paperSize ?? "profile", profile);
}
