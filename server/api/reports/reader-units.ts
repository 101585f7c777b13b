import { eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies } from "../../db/schema/index";
import type { LengthPreference } from "#core/domain/units/format-units";

/** The reader's length unit: their own choice, else the company's default. */
export async function readerLengthUnit(
  ctx: AppContext,
  user: { lengthUnit: LengthPreference | null },
  companyId: string,
): Promise<LengthPreference> {
  if (user.lengthUnit) return user.lengthUnit;
  const [c] = await ctx.db
    .select({ lengthUnit: companies.lengthUnit })
    .from(companies)
    .where(eq(companies.id, companyId));
  return c?.lengthUnit ?? "m";
}
